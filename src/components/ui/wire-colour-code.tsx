import { colourSwatches, describeWireColour } from '#shared/domain/wire-colours.ts';

/**
 * A wire colour as its IEC 60757 code beside a swatch (base fill, stripe across the middle), with
 * the colour in words for screen readers: never the colour alone.
 */
export function WireColourCode({ value }: { value: string }) {
  if (!value) return <span className="text-ink-faint">—</span>;
  const [base, stripe] = colourSwatches(value);
  return (
    <span className="inline-flex items-center gap-1.5">
      {base ? (
        <svg width={14} height={14} viewBox="0 0 14 14" aria-hidden className="shrink-0">
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
      ) : null}
      <span className="font-mono text-[0.8125rem]">{value}</span>
      <span className="sr-only">({describeWireColour(value)})</span>
    </span>
  );
}
