import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';
import { SettingsForm } from '@/features/workshop/components/settings-form.tsx';

export function SettingsRoute() {
  const workshop = useWorkshop();
  return (
    <>
      <PageHeader title="Workshop settings" kicker="Admin">
        Units, paper and defaults used on every conversion in this workshop.
      </PageHeader>
      {workshop.isPending ? (
        <Loading what="Loading settings" />
      ) : workshop.isError ? (
        <Notice tone="fault" title="Settings could not be loaded">
          {workshop.error.message}
        </Notice>
      ) : (
        <SettingsForm workshop={workshop.data} />
      )}
    </>
  );
}
