import svgpath from 'svgpath';
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

/** Each glyph scaled once, as its start point and the rest of the path relative to it. */
const scaledGlyphs = new Map<string, { x: number; y: number; rest: string }>();

function scaledGlyph(disposition: Disposition, scale: number) {
  const key = `${disposition} ${scale}`;
  let glyph = scaledGlyphs.get(key);
  if (!glyph) {
    const text = svgpath(DISPOSITION_INFO[disposition].glyph)
      .scale(scale)
      .rel()
      .round(3)
      .toString();
    const start = /^M(-?[\d.]+)[ ,]?(-?[\d.]+)/.exec(text);
    if (!start) throw new Error(`A disposition glyph must start with a move: ${text}`);
    glyph = { x: Number(start[1]), y: Number(start[2]), rest: text.slice(start[0].length) };
    scaledGlyphs.set(key, glyph);
  }
  return glyph;
}

const round = (n: number) => Math.round(n * 1000) / 1000;

/** The path of a glyph placed with its box's corner at (x, y), `scale` times its 10 × 10 size. */
export function placedGlyph(disposition: Disposition, x: number, y: number, scale: number): string {
  const glyph = scaledGlyph(disposition, scale);
  return `M${round(x + glyph.x)} ${round(y + glyph.y)}${glyph.rest}`;
}

/**
 * The glyph drawn with its box's corner at (x, y) of its parent, `scale` times its 10 × 10 size,
 * as one path with no transform of its own: a face of a thousand cavities with a transform each
 * gave the browser a thousand layers to place on every frame, whatever changed.
 */
export function PlacedGlyphPath({
  disposition,
  x,
  y,
  scale,
  className,
}: {
  disposition: Disposition;
  x: number;
  y: number;
  scale: number;
  className?: string;
}) {
  const info = DISPOSITION_INFO[disposition];
  return (
    <path
      d={placedGlyph(disposition, x, y, scale)}
      className={className}
      fill={info.filled ? 'currentColor' : 'none'}
      stroke="currentColor"
      strokeWidth={info.filled ? 0 : 1.4 * scale}
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
