import { useId, type ChangeEvent } from 'react';
import { ATTACHMENT_TYPE_LABELS } from '#shared/schemas/attachments.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { formatDate } from '@/lib/format-date.ts';
import { useDeleteAttachment } from '../api/delete-attachment.ts';
import { attachmentHref, useAttachments } from '../api/get-attachments.ts';
import { useUploadAttachment } from '../api/upload-attachment.ts';
import { formatBytes } from '../lib/format.ts';

const TYPE_GLYPH: Record<string, string> = {
  'application/pdf': 'PDF',
  'image/png': 'PNG',
  'image/jpeg': 'JPG',
};

/** The original pinout sheets of one connector: PDF or photo scans to download, add or remove. */
export function AttachmentsPanel({
  connectorId,
  connectorLabel,
  canWrite,
}: {
  connectorId: number;
  connectorLabel: string;
  canWrite: boolean;
}) {
  const inputId = useId();
  const list = useAttachments(connectorId);
  const upload = useUploadAttachment(connectorId);
  const remove = useDeleteAttachment(connectorId);

  function choose(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    event.target.value = '';
    if (file) upload.mutate(file);
  }

  return (
    <div className="flex flex-col gap-3">
      {list.isPending ? (
        <Loading what="Loading the scans" />
      ) : list.isError ? (
        <Notice tone="fault" title="The scans could not be loaded">
          {list.error.message}
        </Notice>
      ) : list.data.length === 0 ? (
        <p className="text-sm text-ink-faint">No scans of {connectorLabel} yet.</p>
      ) : (
        <ul className="flex flex-col divide-y divide-rule/70 rounded-lg border border-rule bg-paper-raised">
          {list.data.map((a) => (
            <li key={a.id} className="flex items-center gap-3 px-3 py-2">
              <span
                aria-hidden
                className="grid h-8 w-9 shrink-0 place-items-center rounded border border-rule-strong font-mono text-[0.625rem] font-bold text-ink-soft"
              >
                {TYPE_GLYPH[a.contentType]}
              </span>
              <span className="min-w-0 flex-1">
                <a
                  href={attachmentHref(a.id)}
                  download
                  className="block truncate font-medium text-ink underline decoration-rule-strong underline-offset-2 hover:decoration-copper"
                >
                  {a.fileName}
                </a>
                <span className="block text-xs text-ink-faint">
                  {ATTACHMENT_TYPE_LABELS[a.contentType]}, {formatBytes(a.sizeBytes)} ·{' '}
                  {a.uploadedBy ?? 'someone'}, {formatDate(a.createdAt, 'date')}
                </span>
              </span>
              {canWrite ? (
                <Button
                  size="sm"
                  variant="quiet"
                  aria-label={`Remove ${a.fileName}`}
                  disabled={remove.isPending}
                  onClick={() => remove.mutate(a.id)}
                >
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canWrite ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={inputId} className="text-sm font-medium text-ink-soft">
            Add a scan of {connectorLabel}
          </label>
          <input
            id={inputId}
            type="file"
            accept=".pdf,.png,.jpg,.jpeg,application/pdf,image/png,image/jpeg"
            onChange={choose}
            disabled={upload.isPending}
            className="text-sm file:mr-3 file:rounded-md file:border file:border-rule-strong file:bg-paper-raised file:px-3 file:py-1.5 file:font-medium file:text-ink hover:file:bg-paper-sunk"
          />
          <p className="text-xs text-ink-faint">PDF, PNG or JPEG, at most 10 MB.</p>
        </div>
      ) : null}
      {upload.isPending ? <Loading what="Uploading" /> : null}
      {upload.isError ? (
        <Notice tone="fault" title="The scan was not added">
          {upload.error.message}
        </Notice>
      ) : null}
      {remove.isError ? (
        <Notice tone="fault" title="The scan was not removed">
          {remove.error.message}
        </Notice>
      ) : null}
    </div>
  );
}
