import { DISPOSITION_INFO, type Disposition } from '#shared/domain/dispositions.ts';

/** A disposition as its glyph and its word: never told by colour. */
export function DispositionWord({ disposition }: { disposition: Disposition }) {
  const info = DISPOSITION_INFO[disposition];
  return (
    <span
      className={`inline-flex items-center gap-1.5 ${disposition === 'undecided' ? 'text-ink-faint italic' : ''}`}
    >
      <svg
        viewBox="0 0 10 10"
        width={13}
        height={13}
        aria-hidden
        className="shrink-0 overflow-visible"
      >
        <path
          d={info.glyph}
          fill={info.filled ? 'currentColor' : 'none'}
          stroke="currentColor"
          strokeWidth={info.filled ? 0 : 1.4}
          strokeLinecap="round"
          strokeLinejoin="round"
        />
      </svg>
      {info.label}
    </span>
  );
}
