import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
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
import { errorAt } from '@/lib/form-errors.ts';
import { plural } from '@/lib/plural.ts';

export interface ConnectorFormValues {
  label: string;
  side: ConnectorSide;
  cavityCount: number;
  rows?: number;
  columns?: number;
}

/** An empty rows or columns field takes the usual layout. */
const optionalCount = (value: unknown) =>
  value == null || String(value).trim() === '' ? undefined : Number(value);

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
  const { register, handleSubmit, watch, formState } = useForm({
    resolver: zodResolver(CreateConnectorRequest),
    defaultValues: {
      label: connector?.label ?? '',
      side: connector?.side ?? 'ecu',
      cavityCount: connector?.cavityCount ?? 24,
      rows: connector?.rows,
      columns: connector?.columns,
    },
  });
  // The usual layout for the count as typed, shown as the rows' and columns' placeholder.
  // eslint-disable-next-line react-hooks/incompatible-library
  const count = watch('cavityCount');
  const layout = defaultFaceLayout(Math.max(1, Math.min(MAX_CAVITIES, count || 1)));
  const serverIssues = error instanceof ApiError ? error.fieldIssues() : {};
  const errorOf = (path: string) => errorAt(formState.errors, path) ?? serverIssues[path];
  const submit = handleSubmit(onSubmit);

  const title = connector ? `Change connector ${connector.label}` : 'Add a connector';
  return (
    <form
      onSubmit={(e) => void submit(e)}
      aria-label={title}
      className="grid gap-4 rounded-lg border border-rule bg-paper-raised p-4 sm:grid-cols-2 lg:grid-cols-[repeat(5,minmax(0,1fr))_auto]"
    >
      <h3 className="font-semibold sm:col-span-2 lg:col-span-6">{title}</h3>
      <TextField
        label="Label"
        placeholder="E4"
        required
        maxLength={40}
        {...register('label')}
        error={errorOf('label')}
        className="font-mono"
      />
      <SelectField label="Side" {...register('side')} error={errorOf('side')}>
        {CONNECTOR_SIDES.map((s) => (
          <option key={s} value={s}>
            {CONNECTOR_SIDE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <TextField
        label="Cavities"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        required
        {...register('cavityCount', { valueAsNumber: true })}
        error={errorOf('cavityCount')}
      />
      <TextField
        label="Rows on the face"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        {...register('rows', { setValueAs: optionalCount })}
        placeholder={String(layout.rows)}
        error={errorOf('rows')}
      />
      <TextField
        label="Columns on the face"
        type="number"
        min={1}
        max={MAX_CAVITIES}
        {...register('columns', { setValueAs: optionalCount })}
        placeholder={String(layout.columns)}
        error={errorOf('columns')}
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
        Empty rows and columns take the usual layout for {plural(count || 0, 'cavity', 'cavities')}:{' '}
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
