import { useState } from 'react';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { Loading } from '@/components/ui/loading.tsx';
import { Notice } from '@/components/ui/notice.tsx';
import { useAudit, type AuditFilters } from '../api/audit.ts';
import { formatDate } from '@/lib/format-date.ts';

const ACTIONS: Record<string, string> = {
  create: 'Created',
  update: 'Changed',
  delete: 'Removed',
  bulk_update: 'Set a selection of',
  batch_update: 'Changed several',
  import: 'Imported',
  bench_record: 'Bench work on',
  submit: 'Submitted',
  comment: 'Commented',
  send_back: 'Sent back',
  sign_off: 'Signed off',
};
const ENTITIES: Record<string, string> = {
  conversion: 'Conversion',
  connector: 'Connector',
  pin: 'Pin',
  feed: 'Feed',
  revision: 'Revision',
};

/** "Changed pin", "Changed several pins", "Set a selection of pins", "Bench work on pin". */
function describe(action: string, entityType: string): string {
  const entity = ENTITIES[entityType]?.toLowerCase() ?? entityType;
  const several = action === 'bulk_update' || action === 'batch_update';
  return `${ACTIONS[action] ?? action} ${entity}${several ? 's' : ''}`;
}

function Change({ before, after }: { before: unknown; after: unknown }) {
  if (before == null && after == null) return null;
  return (
    <details className="mt-1">
      <summary className="cursor-pointer text-xs text-ink-faint">Before → after</summary>
      <div className="mt-1 grid gap-2 md:grid-cols-2">
        <pre className="overflow-x-auto rounded bg-paper-sunk p-2 font-mono text-xs">
          {before == null ? '—' : JSON.stringify(before, null, 2)}
        </pre>
        <pre className="overflow-x-auto rounded bg-paper-sunk p-2 font-mono text-xs">
          {after == null ? '—' : JSON.stringify(after, null, 2)}
        </pre>
      </div>
    </details>
  );
}

/** The append-only record of who changed what on a conversion, newest first. */
export function AuditTrail({ conversionId }: { conversionId: number }) {
  const [filters, setFilters] = useState<AuditFilters>({});
  const events = useAudit(conversionId, filters);
  return (
    <div className="flex flex-col gap-4">
      <div className="grid max-w-3xl gap-3 md:grid-cols-3">
        <SelectField
          label="What happened"
          value={filters.action ?? ''}
          onChange={(e) => setFilters({ ...filters, action: e.target.value || undefined })}
        >
          <option value="">Anything</option>
          {Object.entries(ACTIONS).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="To"
          value={filters.entityType ?? ''}
          onChange={(e) => setFilters({ ...filters, entityType: e.target.value || undefined })}
        >
          <option value="">Anything</option>
          {Object.entries(ENTITIES).map(([value, label]) => (
            <option key={value} value={value}>
              {label}
            </option>
          ))}
        </SelectField>
        <TextField
          label="By (full name)"
          value={filters.actor ?? ''}
          onChange={(e) => setFilters({ ...filters, actor: e.target.value || undefined })}
        />
      </div>
      {events.isPending ? (
        <Loading what="Loading the history" />
      ) : events.isError ? (
        <Notice tone="fault" title="History could not be loaded">
          {events.error.message}
        </Notice>
      ) : events.data.length === 0 ? (
        <p className="text-ink-soft">Nothing recorded matches.</p>
      ) : (
        <ol className="flex flex-col divide-y divide-rule rounded-lg border border-rule bg-paper-raised">
          {events.data.map((e) => (
            <li key={e.id} className="px-4 py-3">
              <p className="text-sm text-ink-faint">
                <time dateTime={e.at}>{formatDate(e.at)}</time> ·{' '}
                <span className="font-semibold text-ink">{e.actorName}</span> ·{' '}
                {describe(e.action, e.entityType)}
              </p>
              <p>{e.summary}</p>
              <Change before={e.before} after={e.after} />
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}
