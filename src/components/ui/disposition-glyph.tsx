import { DISPOSITION_INFO, type Disposition } from '#shared/domain/dispositions.ts';

/** The disposition's glyph as SVG children in a 10 × 10 box: the same drawing on every screen. */
export function DispositionGlyphPath({ disposition }: { disposition: Disposition }) {
  const info = DISPOSITION_INFO[disposition];
  return (
    <path
      d={info.glyph}
      fill={info.filled ? 'currentColor' : 'none'}
      stroke="currentColor"
      strokeWidth={info.filled ? 0 : 1.4}
      strokeLinecap="round"
      strokeLinejoin="round"
    />
  );
}

export function DispositionGlyph({
  disposition,
  size = 14,
  className = '',
}: {
  disposition: Disposition;
  size?: number;
  className?: string;
}) {
  return (
    <svg
      viewBox="0 0 10 10"
      width={size}
      height={size}
      aria-hidden
      className={`shrink-0 overflow-visible ${className}`}
    >
      <DispositionGlyphPath disposition={disposition} />
    </svg>
  );
}

/** Glyph and words: disposition is never told by colour. */
export function DispositionLabel({ disposition }: { disposition: Disposition }) {
  return (
    <span
      className={`inline-flex min-w-0 items-center gap-1.5 ${disposition === 'undecided' ? 'text-ink-faint' : ''}`}
    >
      <DispositionGlyph disposition={disposition} />
      <span className="truncate">{DISPOSITION_INFO[disposition].label}</span>
    </span>
  );
}
