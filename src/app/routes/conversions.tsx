import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { paths } from '@/config/paths.ts';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useConversions } from '@/features/conversions/api/get-conversions.ts';
import { ConversionsList } from '@/features/conversions/components/conversions-list.tsx';
import { CreateConversionForm } from '@/features/conversions/components/create-conversion-form.tsx';
import { useWorkshop } from '@/features/workshop/api/workshop.ts';

export function ConversionsRoute() {
  const conversions = useConversions();
  const workshop = useWorkshop();
  const mayCreate = useCan('conversion:write');
  const [creating, setCreating] = useState(false);
  const navigate = useNavigate();

  return (
    <>
      <PageHeader
        title="Conversions"
        kicker={workshop.data?.name}
        actions={
          mayCreate && !creating ? (
            <Button variant="primary" onClick={() => setCreating(true)}>
              New conversion
            </Button>
          ) : null
        }
      >
        Each conversion is one donor engine going into one vehicle: its pin map, new feeds, checks
        and sign-off.
      </PageHeader>
      {creating ? (
        <div className="mb-6">
          <CreateConversionForm
            defaultVoltage={workshop.data?.systemVoltage ?? 12}
            onCancel={() => setCreating(false)}
            onCreated={(c) => navigate(paths.conversion.getHref(c.id))}
          />
        </div>
      ) : null}
      {conversions.isPending ? (
        <Loading what="Loading conversions" />
      ) : conversions.isError ? (
        <Notice tone="fault" title="Conversions could not be loaded">
          {conversions.error.message}
        </Notice>
      ) : (
        <ConversionsList conversions={conversions.data} />
      )}
    </>
  );
}
