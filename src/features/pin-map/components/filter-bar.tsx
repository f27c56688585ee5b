import type { ReactNode } from 'react';
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import {
  SIGNAL_CLASS_LABELS,
  SIGNAL_CLASSES,
  type SignalClass,
} from '#shared/domain/signal-classes.ts';
import type { Connector } from '#shared/schemas/pin-map.schema.ts';
import { Button } from '@/components/ui/button.tsx';
import { isFiltering, NO_FILTER, type PinFilter } from '../lib/filter.ts';
import { plural } from '@/lib/plural.ts';

const CONTROL = 'rounded-md border border-rule-strong bg-paper-raised px-2 py-1.5 text-sm text-ink';

function Labelled({ label, children }: { label: string; children: ReactNode }) {
  return (
    <label className="flex flex-col gap-0.5 text-xs font-medium text-ink-soft">
      {label}
      {children}
    </label>
  );
}

/** Narrows the grid by connector, disposition, signal class and free text. */
export function FilterBar({
  filter,
  onChange,
  connectors,
  shown,
  total,
  children,
}: {
  filter: PinFilter;
  onChange: (filter: PinFilter) => void;
  connectors: readonly Connector[];
  shown: number;
  total: number;
  children?: ReactNode;
}) {
  return (
    <div role="search" aria-label="Filter pins" className="flex flex-wrap items-end gap-3">
      <Labelled label="Connector">
        <select
          className={CONTROL}
          value={filter.connectorId ?? ''}
          onChange={(e) =>
            onChange({ ...filter, connectorId: e.target.value ? Number(e.target.value) : null })
          }
        >
          <option value="">All connectors</option>
          {connectors.map((c) => (
            <option key={c.id} value={c.id}>
              {c.label}
            </option>
          ))}
        </select>
      </Labelled>
      <Labelled label="Disposition">
        <select
          className={CONTROL}
          value={filter.disposition ?? ''}
          onChange={(e) =>
            onChange({ ...filter, disposition: (e.target.value || null) as Disposition | null })
          }
        >
          <option value="">Any disposition</option>
          {DISPOSITIONS.map((d) => (
            <option key={d} value={d}>
              {DISPOSITION_INFO[d].label}
            </option>
          ))}
        </select>
      </Labelled>
      <Labelled label="Signal class">
        <select
          className={CONTROL}
          value={filter.signalClass ?? ''}
          onChange={(e) =>
            onChange({ ...filter, signalClass: (e.target.value || null) as SignalClass | null })
          }
        >
          <option value="">Any signal class</option>
          {SIGNAL_CLASSES.map((s) => (
            <option key={s} value={s}>
              {SIGNAL_CLASS_LABELS[s]}
            </option>
          ))}
        </select>
      </Labelled>
      <Labelled label="Find">
        <input
          type="search"
          className={`${CONTROL} w-64`}
          placeholder="Cavity, function, colour, destination, notes"
          value={filter.text}
          onChange={(e) => onChange({ ...filter, text: e.target.value })}
        />
      </Labelled>
      {isFiltering(filter) ? (
        <Button size="sm" variant="quiet" onClick={() => onChange(NO_FILTER)}>
          Clear filters
        </Button>
      ) : null}
      <p role="status" className="pb-1.5 text-sm text-ink-soft">
        Showing <span className="font-semibold text-ink">{shown}</span> of {plural(total, 'pin')}
      </p>
      <div className="ml-auto">{children}</div>
    </div>
  );
}
