import { DISPOSITION_INFO, DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { decidedOf, totalOf, type DispositionCounts } from '../lib/progress.ts';
import { DispositionGlyph } from '@/components/ui/disposition-glyph.tsx';

/** "31 of 40 decided", a bar of the same, and the count of each disposition in words and glyphs. */
export function DispositionTally({
  counts,
  compact = false,
}: {
  counts: DispositionCounts;
  compact?: boolean;
}) {
  const total = totalOf(counts);
  const decided = decidedOf(counts);
  const share = total ? decided / total : 0;
  return (
    <div className="flex flex-col gap-1.5">
      <div className="flex items-center gap-3">
        <div
          aria-hidden
          className="h-2 min-w-24 flex-1 overflow-hidden rounded-full border border-rule-strong bg-paper-sunk"
        >
          <div className="h-full bg-ink-soft" style={{ width: `${share * 100}%` }} />
        </div>
        <p className="shrink-0 text-sm text-ink-soft">
          <span className="font-semibold text-ink">{decided}</span> of {total} decided
        </p>
      </div>
      <ul
        className={`flex flex-wrap gap-x-3 gap-y-1 ${compact ? 'text-xs' : 'text-sm'} text-ink-soft`}
      >
        {DISPOSITIONS.filter((d) => counts[d] > 0).map((d) => (
          <li key={d} className="inline-flex items-center gap-1">
            <DispositionGlyph disposition={d} size={compact ? 11 : 13} />
            <span>{DISPOSITION_INFO[d].label}</span>
            <span className="font-mono font-semibold text-ink">{counts[d]}</span>
          </li>
        ))}
      </ul>
    </div>
  );
}
