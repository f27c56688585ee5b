import { useMemo } from 'react';
import { useOutletContext, useSearchParams } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { paths } from '@/config/paths.ts';
import { useFeeds } from '@/features/feeds/api/get-feeds.ts';
import { FromTemplateForm } from '@/features/library/components/from-template-form.tsx';
import { PinMapScreen } from '@/features/pin-map/components/pin-map-screen.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';

/**
 * The pin map section of a conversion: sizes in the workshop's unit, the conversion's feeds as
 * destinations, read-only without the right to change the pin map.
 */
export function ConversionPinMapRoute() {
  const conversion = useOutletContext<Conversion>();
  const canWrite = useCan('pinmap:write');
  const [params] = useSearchParams();
  const focusPinId = Number(params.get('pin')) || null;
  const workshop = useWorkshop();
  // A pin can join one of the conversion's new feeds: the feeds feature knows their names.
  const feeds = useFeeds(conversion.id);
  const feedNames = useMemo(
    () => (feeds.data ?? []).map((f) => ({ feedId: f.id, name: f.name })),
    [feeds.data],
  );
  // A pin joined to a feed is one of its loads (the server keeps both sides): the pin writes
  // that join or leave a feed mark the feed list stale (features/pin-map/api/pin-write-cache.ts).
  if (workshop.isPending) return <Loading what="Loading the workshop settings" />;
  if (workshop.isError) {
    return (
      <Notice tone="fault" title="The workshop settings could not be loaded">
        {workshop.error.message}
      </Notice>
    );
  }
  return (
    <PinMapScreen
      key={conversion.id}
      conversionId={conversion.id}
      sizeUnit={workshop.data.sizeUnit}
      readOnly={!canWrite}
      feeds={feedNames}
      focusPinId={focusPinId}
      renderFromLibrary={(added) => (
        <FromTemplateForm conversionId={conversion.id} onCreated={(c) => added(c.id)} />
      )}
      importHref={paths.conversionFiles.getHref(conversion.id)}
    />
  );
}
