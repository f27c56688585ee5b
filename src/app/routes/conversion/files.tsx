import { useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { useOutletContext, useSearchParams } from 'react-router-dom';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { SelectField } from '@/components/ui/field.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { paths } from '@/config/paths.ts';
import { AttachmentsPanel } from '@/features/attachments/components/attachments-panel.tsx';
import { useCan } from '@/features/auth/hooks/use-can.ts';
import { ExportLinks } from '@/features/imports/components/export-links.tsx';
import { ImportWizard } from '@/features/imports/components/import-wizard.tsx';
import { NewConnectorForm } from '@/features/imports/components/new-connector-form.tsx';
import { targetKey, type ImportTarget } from '@/features/imports/lib/import-target.ts';
import { FromTemplateForm } from '@/features/library/components/from-template-form.tsx';
import { SaveTemplateForm } from '@/features/library/components/save-template-form.tsx';
import { connectorChoice } from '@/features/library/lib/connector-choice.ts';
import { useCreateConnector } from '@/features/pin-map/api/create-connector.ts';
import { useConnectors } from '@/features/pin-map/api/get-connectors.ts';
import { pinMapKeys } from '@/features/pin-map/api/keys.ts';

const WHOLE = 'conversion';
const NEW = 'new';

/**
 * What the connector select shows: the one asked for in the address when it exists (the whole
 * conversion or a new connector only for those who may import), else the first connector.
 */
function chooseSelection(wanted: string | null, ids: string[], canImport: boolean): string {
  if (wanted === NEW || wanted === WHOLE) return canImport ? wanted : '';
  if (wanted !== null && ids.includes(wanted)) return wanted;
  if (ids[0] !== undefined) return ids[0];
  return canImport ? NEW : '';
}

function Card({ title, children }: { title: string; children: ReactNode }) {
  const id = `files-${title.replace(/\W+/g, '-').toLowerCase()}`;
  return (
    <section
      aria-labelledby={id}
      className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised/60 p-4"
    >
      <h2 id={id} className="font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * Import & files: a pinout CSV into a connector (or the whole conversion), the CSV export, the
 * reference scans of a connector and the pinout library, composed from their features.
 */
export function ConversionFilesRoute() {
  const conversion = useOutletContext<Conversion>();
  const canImport = useCan('pinmap:write');
  const canAttach = useCan('attachment:write');
  const canSaveTemplate = useCan('library:write');
  const queryClient = useQueryClient();
  const connectors = useConnectors(conversion.id);
  const createConnector = useCreateConnector(conversion.id);
  const [params, setParams] = useSearchParams();

  const refreshPinMap = () =>
    queryClient.invalidateQueries({ queryKey: pinMapKeys.conversion(conversion.id) });

  if (connectors.isPending) return <Loading what="Loading the connectors" />;
  if (connectors.isError) {
    return (
      <Notice tone="fault" title="The connectors could not be loaded">
        {connectors.error.message}
      </Notice>
    );
  }
  const list = connectors.data;
  const selection = chooseSelection(
    params.get('connector'),
    list.map((c) => String(c.id)),
    canImport,
  );
  const select = (value: string) => setParams({ connector: value }, { replace: true });
  const connector = list.find((c) => String(c.id) === selection) ?? null;
  const target: ImportTarget | null = connector
    ? { kind: 'connector', connectorId: connector.id, label: connector.label }
    : selection === WHOLE
      ? { kind: 'conversion', conversionId: conversion.id }
      : null;
  const choices = list.map(connectorChoice);

  return (
    <div className="flex flex-col gap-8">
      <section aria-labelledby="import-heading" className="flex flex-col gap-4">
        <div>
          <h2 id="import-heading" className="text-lg font-semibold">
            Pinout files
          </h2>
          <p className="max-w-3xl text-sm text-ink-soft">
            Bring in a pinout typed up or received as a spreadsheet. Every problem is shown in its
            cell before anything is written, and a file goes in whole or not at all. A connector’s
            file is its whole pinout: cavities it adds are added, blank cavities it leaves out are
            removed.
          </p>
        </div>
        <div className="max-w-md">
          <SelectField label="Connector" value={selection} onChange={(e) => select(e.target.value)}>
            {selection === '' ? <option value="">No connectors yet</option> : null}
            {choices.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label} — {c.detail}
              </option>
            ))}
            {canImport ? (
              <>
                <option value={WHOLE}>Whole conversion (each row names its connector)</option>
                <option value={NEW}>New connector…</option>
              </>
            ) : null}
          </SelectField>
        </div>
        {selection === NEW ? (
          <NewConnectorForm
            busy={createConnector.isPending}
            error={createConnector.error}
            onCancel={() => list[0] && select(String(list[0].id))}
            onCreate={(values) =>
              createConnector.mutate(
                { ...values, cavityCount: 1 },
                { onSuccess: ({ connector: created }) => select(String(created.id)) },
              )
            }
          />
        ) : target && canImport ? (
          <ImportWizard
            key={targetKey(target)}
            target={target}
            pinMapHref={paths.conversionPins.getHref(conversion.id)}
            onApplied={() => void refreshPinMap()}
          />
        ) : !canImport ? (
          <Notice tone="info" title="Importing is for builders and admins">
            You can download the pins as CSV and read the reference scans below.
          </Notice>
        ) : null}
      </section>

      <div className="grid gap-6 lg:grid-cols-3">
        <Card title="Export">
          <ExportLinks conversionId={conversion.id} />
        </Card>
        <Card title={connector ? `Reference scans of ${connector.label}` : 'Reference scans'}>
          {connector ? (
            <AttachmentsPanel
              key={connector.id}
              connectorId={connector.id}
              connectorLabel={connector.label}
              canWrite={canAttach}
            />
          ) : (
            <p className="text-sm text-ink-faint">
              Choose a connector above to see the original pinout sheets kept with it.
            </p>
          )}
        </Card>
        <Card title="Pinout library">
          {canSaveTemplate ? (
            <>
              <SaveTemplateForm connectors={choices} defaultConnectorId={connector?.id} />
              <hr className="border-rule" />
            </>
          ) : null}
          {canImport ? (
            <FromTemplateForm
              conversionId={conversion.id}
              onCreated={(created) => {
                void refreshPinMap();
                select(String(created.id));
              }}
            />
          ) : (
            <p className="text-sm text-ink-faint">
              Templates are listed on the Pinout library page.
            </p>
          )}
        </Card>
      </div>
    </div>
  );
}
