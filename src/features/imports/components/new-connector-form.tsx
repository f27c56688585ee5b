import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
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
import { errorAt } from '@/lib/form-errors.ts';

/** A label and a side, as the connector schema checks them; the file brings the cavities. */
const NewConnector = z.object({ label: requiredText(40), side: z.enum(CONNECTOR_SIDES) });

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
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(NewConnector),
    defaultValues: { label: '', side: 'ecu' as const },
  });
  const serverIssues = error instanceof ApiError ? error.fieldIssues() : {};
  const submit = handleSubmit(onCreate);

  return (
    <form
      onSubmit={(e) => void submit(e)}
      aria-label="New connector"
      className="grid gap-3 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-[1fr_1fr_auto]"
    >
      <TextField
        label="Connector label"
        maxLength={40}
        placeholder="e.g. E4"
        {...register('label')}
        error={errorAt(formState.errors, 'label') ?? serverIssues.label}
        hint="Starts with one cavity; the import adds the file’s cavities."
      />
      <SelectField label="Side" {...register('side')}>
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
