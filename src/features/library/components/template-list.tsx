import { useState } from 'react';
import type { PinoutTemplate } from '#shared/schemas/library.schema.ts';
import { CONNECTOR_SIDE_LABELS } from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useDeleteTemplate } from '../api/delete-template.ts';
import { useTemplate } from '../api/get-template.ts';
import { useTemplates } from '../api/get-templates.ts';
import { TemplatePinsTable } from './template-pins-table.tsx';
import { formatDate } from '@/lib/format-date.ts';
import { plural } from '@/lib/plural.ts';

function TemplatePins({ template }: { template: PinoutTemplate }) {
  const detail = useTemplate(template.id);
  if (detail.isPending) return <Loading what="Loading the pins" />;
  if (detail.isError) {
    return (
      <Notice tone="fault" title="The pins could not be loaded">
        {detail.error.message}
      </Notice>
    );
  }
  return <TemplatePinsTable pins={detail.data.pins} caption={`Pins of ${template.name}`} />;
}

function TemplateCard({ template, canWrite }: { template: PinoutTemplate; canWrite: boolean }) {
  const [open, setOpen] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const remove = useDeleteTemplate();
  const headingId = `template-${template.id}`;
  return (
    <li
      aria-labelledby={headingId}
      className="flex flex-col gap-3 rounded-lg border border-rule bg-paper-raised p-4"
    >
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0">
          <h3 id={headingId} className="text-lg font-semibold">
            {template.name}
          </h3>
          <p className="mt-0.5 flex flex-wrap gap-x-3 text-sm text-ink-soft">
            <span>{CONNECTOR_SIDE_LABELS[template.side]}</span>
            <span>
              {plural(template.cavityCount, 'cavity', 'cavities')}, {template.rows} ×{' '}
              {template.columns} face
            </span>
            {template.builtIn ? (
              <span className="font-medium text-copper-deep">
                <span aria-hidden>◆ </span>Built-in, read-only
              </span>
            ) : (
              <span>
                Saved by {template.createdBy ?? 'someone'}, {formatDate(template.createdAt, 'date')}
              </span>
            )}
          </p>
          {template.description ? (
            <p className="mt-1 max-w-3xl text-sm text-ink-soft">{template.description}</p>
          ) : null}
        </div>
        <div className="flex gap-2">
          <Button
            size="sm"
            aria-expanded={open}
            aria-controls={`${headingId}-pins`}
            onClick={() => setOpen((v) => !v)}
          >
            {open ? 'Hide pins' : 'Show pins'}
          </Button>
          {canWrite && !template.builtIn && !confirming ? (
            <Button size="sm" variant="danger" onClick={() => setConfirming(true)}>
              Delete
            </Button>
          ) : null}
        </div>
      </div>
      {confirming ? (
        <div className="flex flex-wrap items-center gap-3 rounded-md border border-fault/40 bg-fault-wash px-3 py-2 text-sm">
          <span>
            Delete “{template.name}” from the library? Connectors started from it keep their pins.
          </span>
          <Button
            size="sm"
            variant="danger"
            busy={remove.isPending}
            onClick={() => remove.mutate(template.id)}
          >
            Delete template
          </Button>
          <Button size="sm" variant="quiet" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : null}
      {remove.isError ? (
        <Notice tone="fault" title="The template was not deleted">
          {remove.error.message}
        </Notice>
      ) : null}
      {open ? (
        <div id={`${headingId}-pins`}>
          <TemplatePins template={template} />
        </div>
      ) : null}
    </li>
  );
}

/** The workshop's pinout templates and the built-in ones, each with its pins on request. */
export function TemplateList({ canWrite }: { canWrite: boolean }) {
  const templates = useTemplates();
  if (templates.isPending) return <Loading what="Loading the library" />;
  if (templates.isError) {
    return (
      <Notice tone="fault" title="The library could not be loaded">
        {templates.error.message}
      </Notice>
    );
  }
  return (
    <ul aria-label="Pinout templates" className="flex flex-col gap-3">
      {templates.data.map((t) => (
        <TemplateCard key={t.id} template={t} canWrite={canWrite} />
      ))}
    </ul>
  );
}
