import { useState } from 'react';
import { SelectField } from '@/components/ui/field.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { PageHeader } from '@/components/ui/page-header.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { useConversions } from '@/features/conversions/api/get-conversions.ts';
import { SaveTemplateForm } from '@/features/library/components/save-template-form.tsx';
import { TemplateList } from '@/features/library/components/template-list.tsx';
import { connectorChoice } from '@/features/library/lib/connector-choice.ts';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';

function SaveFromConversion({ conversionId }: { conversionId: number }) {
  const connectors = useConnectors(conversionId);
  if (connectors.isPending) return <Loading what="Loading the connectors" />;
  if (connectors.isError) return <p className="text-sm text-fault">{connectors.error.message}</p>;
  return <SaveTemplateForm key={conversionId} connectors={connectors.data.map(connectorChoice)} />;
}

/** The pinout library: templates to start connectors from, and saving a connector as one. */
export function LibraryRoute() {
  const canWrite = useCan('library:write');
  const conversions = useConversions();
  const [chosen, setChosen] = useState<number | null>(null);
  const conversionId = chosen ?? conversions.data?.[0]?.id ?? null;

  return (
    <>
      <PageHeader title="Pinout library" kicker="Workshop">
        Connector pinouts the shop maps again and again: cavities, face layout and each pin’s
        function, wire and usual decision. Start a conversion’s connector from one on its Import
        &amp; files page.
      </PageHeader>
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <TemplateList canWrite={canWrite} />
        {canWrite ? (
          <aside
            aria-labelledby="save-template-heading"
            className="flex h-fit flex-col gap-3 rounded-lg border border-rule bg-paper-raised/60 p-4"
          >
            <h2 id="save-template-heading" className="font-semibold">
              Save a connector as a template
            </h2>
            {conversions.isPending ? (
              <Loading what="Loading conversions" />
            ) : conversions.data?.length && conversionId !== null ? (
              <>
                <SelectField
                  label="From conversion"
                  value={String(conversionId)}
                  onChange={(e) => setChosen(Number(e.target.value))}
                >
                  {conversions.data.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name}
                    </option>
                  ))}
                </SelectField>
                <SaveFromConversion conversionId={conversionId} />
              </>
            ) : (
              <p className="text-sm text-ink-faint">No conversions yet.</p>
            )}
          </aside>
        ) : null}
      </div>
    </>
  );
}
