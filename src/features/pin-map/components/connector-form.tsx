import { useState, type FormEvent } from 'react';
import {
  CONNECTOR_SIDE_LABELS,
  CONNECTOR_SIDES,
  CreateConnectorRequest,
  defaultFaceLayout,
  MAX_CAVITIES,
  type Connector,
  type ConnectorSide,
} from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { ApiError } from '@/lib/api-client.ts';

export interface ConnectorFormValues {
  label: string;
  side: ConnectorSide;
  cavityCount: number;
  rows?: number;
  columns?: number;
}

function fieldErrors(result: ReturnType<typeof CreateConnectorRequest.safeParse>) {
  if (result.success) return {};
  return Object.fromEntries(
    result.error.issues.map((i) => [String(i.path[0] ?? 'form'), i.message]),
  ) as Record<string, string>;
}

const optionalCount = (value: FormDataEntryValue | null) =>
  value === null || String(value).trim() === '' ? undefined : Number(value);

/**
 * Adds a connector, or changes one: label, side, cavity count and the face layout (rows ×
 * columns). Empty rows and columns take the usual layout for the cavity count, shown as a hint.
 */
export function ConnectorForm({
  connector,
  busy,
  error,
  onSubmit,
  onCancel,
}: {
  connector?: Connector;
  busy: boolean;
  error: Error | null;
  onSubmit: (values: ConnectorFormValues) => void;
  onCancel: () => void;
}) {
  const [count, setCount] = useState(connector?.cavityCount ?? 24);
  const [issues, setIssues] = useState<Record<string, string>>({});
  const layout = defaultFaceLayout(Math.max(1, Math.min(MAX_CAVITIES, count || 1)));
  const serverIssues = error instanceof ApiError ? error.fieldIssues() : {};
  const errors = { ...serverIssues, ...issues };

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const values = {
      label: String(form.get('label') ?? '').trim(),
      side: String(form.get('side')) as ConnectorSide,
      cavityCount: Number(form.get('cavityCount')),
      rows: optionalCount(form.get('rows')),
      columns: optionalCount(form.get('columns')),
    };
    const result = CreateConnectorRequest.safeParse(values);
    setIssues(fieldErrors(result));
    if (result.success) onSubmit(values);
  }

  const title = connector ? `Change connector ${connector.label}` : 'Add a connector';
  return (
    <form
      onSubmit={submit}
      aria-label={title}
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-2 lg:grid-cols-[repeat(5,minmax(0,1fr))_auto]"
    >
      <h3 className="font-semibold sm:col-span-2 lg:col-span-6">{title}</h3>
      <TextField
        label="Label"
        name="label"
        defaultValue={connector?.label ?? ''}
        placeholder="E4"
        required
        maxLength={40}
        error={errors.label}
        className="font-mono"
      />
      <SelectField
        label="Side"
        name="side"
        defaultValue={connector?.side ?? 'ecu'}
        error={errors.side}
      >
        {CONNECTOR_SIDES.map((s) => (
          <option key={s} value={s}>
            {CONNECTOR_SIDE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Cavities"
        name="cavityCount"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        required
        value={Number.isNaN(count) ? '' : count}
        onChange={(e) => setCount(e.target.valueAsNumber)}
        error={errors.cavityCount}
      />
      <TextField
        label="Rows on the face"
        name="rows"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        defaultValue={connector?.rows}
        placeholder={String(layout.rows)}
        error={errors.rows}
      />
      <TextField
        label="Columns on the face"
        name="columns"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        defaultValue={connector?.columns}
        placeholder={String(layout.columns)}
        error={errors.columns}
      />
      <div className="flex items-end gap-2 whitespace-nowrap">
        <Button type="submit" variant="primary" busy={busy}>
          {connector ? 'Save connector' : 'Add connector'}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      <p className="text-sm text-ink-faint sm:col-span-2 lg:col-span-6">
        Empty rows and columns take the usual layout for {count || 0} cavities:{' '}
        <span className="font-mono">
          {layout.rows} × {layout.columns}
        </span>
        .{' '}
        {connector
          ? 'Removing cavities is refused while they hold wire data or decisions.'
          : 'The cavities start undecided, numbered 1 to ' + (count || 0) + '.'}
      </p>
      {error && !(error instanceof ApiError && Object.keys(serverIssues).length) ? (
        <div className="sm:col-span-2 lg:col-span-6">
          <Notice tone="fault" title="The connector was not saved">
            {error.message}
          </Notice>
        </div>
      ) : null}
    </form>
  );
}
