import { colourSwatches, describeWireColour } from '#shared/domain/wire-colours.ts';

/** A swatch of a wire colour: the base fills it, a stripe runs across the middle. */
export function ColourSwatch({ value, size = 14 }: { value: string; size?: number }) {
  const [base, stripe] = colourSwatches(value);
  if (!base) return null;
  return (
    <svg width={size} height={size} viewBox="0 0 14 14" aria-hidden className="shrink-0">
      <rect x="0.5" y="0.5" width="13" height="13" rx="2" fill={base} />
      {stripe ? <rect x="0.5" y="5" width="13" height="4" fill={stripe} /> : null}
      <rect
        x="0.5"
        y="0.5"
        width="13"
        height="13"
        rx="2"
        fill="none"
        stroke="var(--color-ink)"
        strokeOpacity="0.55"
      />
    </svg>
  );
}

/** Swatch and code together (never the colour alone), with the colour in words for screen readers. */
export function WireColour({ value }: { value: string }) {
  if (!value) return <span className="text-ink-faint">—</span>;
  return (
    <span className="inline-flex items-center gap-1.5">
      <ColourSwatch value={value} />
      <span className="font-mono text-[0.8125rem]">{value}</span>
      <span className="sr-only">({describeWireColour(value)})</span>
    </span>
  );
}
