import { useState, type FormEvent } from 'react';
import { requiredText } from '#shared/schemas/common.schema.ts';
import {
  CONNECTOR_SIDE_LABELS,
  CONNECTOR_SIDES,
  type ConnectorSide,
} from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';

const Label = requiredText(40);

/** A new, empty connector to import into: a label and a side; the file brings the cavities. */
export function NewConnectorForm({
  busy,
  error,
  onCreate,
  onCancel,
}: {
  busy: boolean;
  error: Error | null;
  onCreate: (values: { label: string; side: ConnectorSide }) => void;
  onCancel: () => void;
}) {
  const [labelError, setLabelError] = useState<string>();
  const serverIssues = error instanceof ApiError ? error.fieldIssues() : {};

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const label = Label.safeParse(form.get('label'));
    if (!label.success) {
      setLabelError(label.error.issues[0]?.message);
      return;
    }
    setLabelError(undefined);
    onCreate({ label: label.data, side: String(form.get('side')) as ConnectorSide });
  }

  return (
    <form
      onSubmit={submit}
      aria-label="New connector"
      className="grid gap-3 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-[1fr_1fr_auto]"
    >
      <TextField
        label="Connector label"
        name="label"
        maxLength={40}
        placeholder="e.g. E4"
        error={labelError ?? serverIssues.label}
        hint="Starts with one cavity; the import adds the file’s cavities."
      />
      <SelectField label="Side" name="side" defaultValue="ecu">
        {CONNECTOR_SIDES.map((side) => (
          <option key={side} value={side}>
            {CONNECTOR_SIDE_LABELS[side]}
          </option>
        ))}
      </SelectField>
      <div className="flex items-end gap-2 pb-0.5">
        <Button type="submit" variant="primary" busy={busy}>
          Create connector
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {error && !serverIssues.label ? (
        <div className="sm:col-span-3">
          <Notice tone="fault" title="The connector was not created">
            {error.message}
          </Notice>
        </div>
      ) : null}
    </form>
  );
}
