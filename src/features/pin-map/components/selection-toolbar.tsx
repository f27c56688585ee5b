import { useId, useState, type FormEvent } from 'react';
import { DISPOSITION_INFO, DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import { Button } from '@/components/ui/button.tsx';
import { parseDestination, type DestinationSet } from '../lib/cell-values.ts';
import { feedDestination, type DestinationCavity, type DestinationFeed } from '../lib/rows.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';

/** Acts on every selected pin at once: one disposition, or one destination. */
export function SelectionToolbar({
  count,
  hiddenCount,
  destinations,
  feeds,
  onSetDisposition,
  onSetDestination,
  onClear,
}: {
  count: number;
  /** Selected pins the filters hide right now. */
  hiddenCount: number;
  destinations: readonly DestinationCavity[];
  feeds: readonly DestinationFeed[];
  onSetDisposition: (disposition: Disposition) => void;
  onSetDestination: (destination: DestinationSet) => void;
  onClear: () => void;
}) {
  const id = useId();
  const [destination, setDestination] = useState('');
  const [error, setError] = useState<string | null>(null);

  function submitDestination(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    // A selection never holds its own destination check; the server refuses a self-link.
    const parsed = parseDestination(destination, destinations, null, feeds);
    if (!parsed.ok) return setError(parsed.error);
    setError(null);
    onSetDestination(parsed.value);
    setDestination('');
  }

  return (
    <section
      aria-label="Selected pins"
      className="flex flex-wrap items-center gap-x-4 gap-y-2 rounded-lg border border-ink-soft/60 bg-paper-sunk px-4 py-2.5"
    >
      <p className="text-sm font-semibold">
        {count} pin{count === 1 ? '' : 's'} selected
        {hiddenCount ? (
          <span className="font-normal text-ink-soft"> ({hiddenCount} hidden by the filters)</span>
        ) : null}
      </p>
      <div
        role="group"
        aria-label="Set disposition of the selected pins"
        className="flex flex-wrap items-center gap-1"
      >
        <span className="mr-1 text-sm text-ink-soft">Set disposition:</span>
        {DISPOSITIONS.filter((d) => d !== 'undecided').map((d) => (
          <Button key={d} size="sm" variant="secondary" onClick={() => onSetDisposition(d)}>
            <DispositionGlyph disposition={d} size={12} />
            {DISPOSITION_INFO[d].label}
          </Button>
        ))}
      </div>
      <form onSubmit={submitDestination} className="flex items-center gap-1">
        <label htmlFor={`${id}-dest`} className="text-sm text-ink-soft">
          Destination:
        </label>
        <input
          id={`${id}-dest`}
          list={`${id}-cavities`}
          value={destination}
          onChange={(e) => setDestination(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-dest-error` : undefined}
          placeholder="V1-3 or free text"
          className="w-44 rounded-md border border-rule-strong bg-paper-raised px-2 py-1 text-sm aria-[invalid=true]:border-fault"
        />
        <datalist id={`${id}-cavities`}>
          {feeds.map((f) => (
            <option key={`feed-${f.feedId}`} value={feedDestination(f.name)}>
              new fused feed
            </option>
          ))}
          {destinations.map((d) => (
            <option key={d.pinId} value={d.name}>
              {d.function}
            </option>
          ))}
        </datalist>
        <Button size="sm" type="submit">
          Set destination
        </Button>
        {error ? (
          <p id={`${id}-dest-error`} className="text-sm text-fault">
            <span aria-hidden>✕ </span>
            {error}
          </p>
        ) : null}
      </form>
      <Button size="sm" variant="quiet" className="ml-auto" onClick={onClear}>
        Clear selection
      </Button>
    </section>
  );
}
