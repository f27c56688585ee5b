import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import {
  CONVERSION_STATE_LABELS,
  CONVERSION_STATES,
  type ConversionListItem,
  type ConversionState,
} from '#shared/schemas/conversions.schema.ts';
import { SelectField, TextField } from '@/components/ui/field.tsx';
import { ConversionsTable, listOrder } from './conversions-table.tsx';

const isState = (v: string | null): v is ConversionState =>
  (CONVERSION_STATES as readonly string[]).includes(v ?? '');

/** Folds case and accents so "corran" finds "Corrán". */
const fold = (s: string) => s.normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();

/**
 * The conversions, searched by name, donor engine or vehicle and filtered by state; both kept in
 * the address so a filtered list can be bookmarked or shared.
 */
export function ConversionsList({ conversions }: { conversions: ConversionListItem[] }) {
  const [params, setParams] = useSearchParams();
  const query = params.get('q') ?? '';
  const stateParam = params.get('state');
  const state = isState(stateParam) ? stateParam : null;

  const set = (key: string, value: string) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );

  const shown = useMemo(() => {
    const words = fold(query).split(/\s+/).filter(Boolean);
    return conversions
      .filter((c) => !state || c.state === state)
      .filter((c) => {
        const text = fold(`${c.name} ${c.donorEngine} ${c.receivingVehicle}`);
        return words.every((w) => text.includes(w));
      })
      .sort(listOrder);
  }, [conversions, query, state]);

  const counts = useMemo(() => {
    const n: Record<ConversionState, number> = {
      draft: 0,
      in_review: 0,
      changes_requested: 0,
      signed_off: 0,
    };
    for (const c of conversions) n[c.state] += 1;
    return n;
  }, [conversions]);
  const waiting = conversions.filter((c) => c.waitingForYou).length;

  return (
    <div className="flex flex-col gap-4">
      {waiting ? (
        <p className="font-semibold text-copper">
          {waiting === 1
            ? '1 conversion is waiting for your review.'
            : `${waiting} conversions are waiting for your review.`}
        </p>
      ) : null}
      <div className="flex flex-wrap items-end gap-4">
        <div className="w-72">
          <TextField
            label="Search conversions"
            type="search"
            placeholder="Name, donor engine or vehicle"
            value={query}
            onChange={(e) => set('q', e.target.value)}
          />
        </div>
        <div className="w-56">
          <SelectField
            label="State"
            value={state ?? ''}
            onChange={(e) => set('state', e.target.value)}
          >
            <option value="">Every state ({conversions.length})</option>
            {CONVERSION_STATES.map((s) => (
              <option key={s} value={s}>
                {CONVERSION_STATE_LABELS[s]} ({counts[s]})
              </option>
            ))}
          </SelectField>
        </div>
        <p className="pb-2 text-sm text-ink-soft" aria-live="polite">
          {shown.length === conversions.length
            ? ''
            : `Showing ${shown.length} of ${conversions.length}`}
        </p>
      </div>
      <ConversionsTable conversions={shown} />
    </div>
  );
}
