import { memo, startTransition, useEffect, useId, useState, type KeyboardEvent } from 'react';
import { DISPOSITION_INFO, DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { describeWireColour } from '#shared/domain/wire-colours.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { faceCavities, type FaceCavity } from '../lib/face.ts';
import type { DispositionCounts } from '../lib/progress.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import { PlacedGlyphPath, DispositionLabel } from '@/components/ui/disposition-glyph.tsx';
import { WireColour } from '@/components/ui/wire-colour.tsx';
import { plural } from '@/lib/plural.ts';
import { useStableHandler } from '../hooks/use-stable-handler.ts';

interface FaceProps {
  connector: Connector;
  /** This connector's pins. */
  pins: readonly Pin[];
  counts: DispositionCounts;
  unit: SizeUnit;
  onActivate: (pinId: number) => void;
}

const PITCH = 34;
const BOX = 28;
const MARGIN = 12;

function describeCavity(connectorLabel: string, pin: Pin, unit: SizeUnit): string {
  const parts = [
    `Cavity ${cavityName(connectorLabel, pin.cavity)}`,
    pin.function || 'no function recorded',
    pin.colour ? `wire ${pin.colour}, ${describeWireColour(pin.colour)}` : 'no wire colour',
    pin.sizeMm2 != null ? formatWireSize(pin.sizeMm2, unit) : 'no size',
    DISPOSITION_INFO[pin.disposition].label,
  ];
  return parts.join('; ');
}

const faceSize = (connector: Connector) => ({
  width: MARGIN * 2 + connector.columns * PITCH - (PITCH - BOX),
  height: MARGIN * 2 + connector.rows * PITCH - (PITCH - BOX),
});

/**
 * True once the page has painted the grid: the face is drawn in a transition after the first
 * render, so a click or key press in the grid goes first. Every face is then drawn, on screen or
 * not, so keyboard and screen-reader users reach each cavity and a link to a cavity finds it.
 */
function useDrawnAfterPaint() {
  const [drawn, setDrawn] = useState(false);
  useEffect(() => {
    const frame = requestAnimationFrame(() => startTransition(() => setDrawn(true)));
    return () => cancelAnimationFrame(frame);
  }, []);
  return drawn;
}

/**
 * A connector seen from its mating face: each cavity in its row and column, marked with its
 * disposition's glyph and its label. Clicking a cavity (or Enter on it) goes to its row in the
 * grid. Until the grid has painted, a blank of the same size holds its place.
 */
export const ConnectorFace = memo(function ConnectorFace(props: FaceProps) {
  const drawn = useDrawnAfterPaint();
  if (drawn) return <FaceDrawing {...props} />;
  const { width, height } = faceSize(props.connector);
  return (
    <div className="relative w-fit max-w-full" aria-hidden>
      <div className="overflow-x-auto">
        <div style={{ width, height }} className="rounded-lg bg-paper-sunk" />
      </div>
    </div>
  );
}, sameFace);

function FaceDrawing({ connector, pins, counts, unit, onActivate }: FaceProps) {
  const id = useId().replace(/[^a-zA-Z0-9]/g, '');
  const cavities = faceCavities(connector, pins);
  const [shown, setShown] = useState<FaceCavity | null>(null);
  const [focusIndex, setFocusIndex] = useState(0);
  const { width, height } = faceSize(connector);
  const at = (c: FaceCavity) => ({ x: MARGIN + c.column * PITCH, y: MARGIN + c.row * PITCH });
  const summary = DISPOSITIONS.filter((d) => counts[d] > 0)
    .map((d) => `${counts[d]} ${DISPOSITION_INFO[d].label.toLowerCase()}`)
    .join(', ');

  function focusCavity(index: number) {
    const next = Math.min(Math.max(index, 0), cavities.length - 1);
    setFocusIndex(next);
    document.getElementById(`${id}-cavity-${next}`)?.focus();
  }

  // Stable, so a cavity redraws only when its own pin (or its focusability) changes.
  const onCavityKey = useStableHandler(
    (event: KeyboardEvent<SVGGElement>, index: number, pinId: number) => {
      const step: Record<string, number> = {
        ArrowRight: 1,
        ArrowLeft: -1,
        ArrowDown: connector.columns,
        ArrowUp: -connector.columns,
      };
      if (event.key in step) {
        event.preventDefault();
        focusCavity(index + step[event.key]!);
      } else if (event.key === 'Enter' || event.key === ' ') {
        event.preventDefault();
        onActivate(pinId);
      }
    },
  );
  const onShow = useStableHandler((index: number | null, focused = false) => {
    if (focused && index !== null) setFocusIndex(index);
    setShown(index === null ? null : (cavities[index] ?? null));
  });

  const tip = shown ? at(shown) : null;
  return (
    <div className="relative w-fit max-w-full">
      {/* Out of view, the browser skips the face's layout and paint (its size is known): an edit
          elsewhere on the page does not restyle hundreds of cavities. The tooltip sits outside. */}
      <div
        className="overflow-x-auto"
        style={{
          contentVisibility: 'auto',
          containIntrinsicSize: `auto ${width}px auto ${height}px`,
        }}
      >
        <svg
          width={width}
          height={height}
          viewBox={`0 0 ${width} ${height}`}
          role="group"
          aria-labelledby={`${id}-title`}
          aria-describedby={`${id}-desc`}
          className="block"
        >
          <title id={`${id}-title`}>
            {`Face of connector ${connector.label}: ${connector.rows} × ${connector.columns}, ${plural(connector.cavityCount, 'cavity', 'cavities')}`}
          </title>
          <desc
            id={`${id}-desc`}
          >{`${summary}. Choose a cavity to go to its row in the grid.`}</desc>
          <rect
            x={1}
            y={1}
            width={width - 2}
            height={height - 2}
            rx={8}
            className="fill-paper-sunk stroke-rule-strong"
          />
          <rect
            x={width / 2 - 14}
            y={-1}
            width={28}
            height={5}
            rx={2}
            className="fill-rule-strong"
          />
          {cavities.map((cavity, index) => (
            <CavityMark
              key={cavity.pin.id}
              id={`${id}-cavity-${index}`}
              index={index}
              pin={cavity.pin}
              row={cavity.row}
              column={cavity.column}
              label={connector.label}
              unit={unit}
              focusable={index === focusIndex}
              onKey={onCavityKey}
              onShow={onShow}
              onActivate={onActivate}
            />
          ))}
        </svg>
      </div>
      {shown && tip ? (
        <div
          role="tooltip"
          className="pointer-events-none absolute z-30 w-64 rounded-md border border-rule-strong bg-paper-raised px-3 py-2 text-sm shadow-lg"
          style={{ left: Math.min(tip.x, Math.max(0, width - 256)), top: tip.y + BOX + 6 }}
        >
          <p className="font-mono font-semibold">{cavityName(connector.label, shown.pin.cavity)}</p>
          <p className="text-ink">
            {shown.pin.function || <span className="text-ink-faint">No function recorded</span>}
          </p>
          <p className="mt-1 flex items-center gap-3 text-ink-soft">
            <WireColour value={shown.pin.colour} />
            <span className="font-mono text-[0.8125rem]">
              {shown.pin.sizeMm2 != null ? formatWireSize(shown.pin.sizeMm2, unit) : 'no size'}
            </span>
          </p>
          <p className="mt-1">
            <DispositionLabel disposition={shown.pin.disposition} />
          </p>
        </div>
      ) : null}
    </div>
  );
}

interface CavityProps {
  id: string;
  index: number;
  pin: Pin;
  row: number;
  column: number;
  label: string;
  unit: SizeUnit;
  focusable: boolean;
  onKey: (event: KeyboardEvent<SVGGElement>, index: number, pinId: number) => void;
  onShow: (index: number | null, focused?: boolean) => void;
  onActivate: (pinId: number) => void;
}

/** One cavity of a face. Memoised: an edit redraws the cavity it changed, not all 400. */
const CavityMark = memo(function CavityMark({
  id,
  index,
  pin,
  row,
  column,
  label,
  unit,
  focusable,
  onKey,
  onShow,
  onActivate,
}: CavityProps) {
  const x = MARGIN + column * PITCH;
  const y = MARGIN + row * PITCH;
  const undecided = pin.disposition === 'undecided';
  return (
    <g
      id={id}
      role="button"
      tabIndex={focusable ? 0 : -1}
      aria-label={describeCavity(label, pin, unit)}
      onClick={() => onActivate(pin.id)}
      onKeyDown={(e) => onKey(e, index, pin.id)}
      onMouseEnter={() => onShow(index)}
      onMouseLeave={() => onShow(null)}
      onFocus={() => onShow(index, true)}
      onBlur={() => onShow(null)}
      className="group/cavity cursor-pointer outline-none"
    >
      <rect
        x={x}
        y={y}
        width={BOX}
        height={BOX}
        rx={5}
        strokeDasharray={undecided ? '3 2' : undefined}
        className={`fill-paper-raised ${undecided ? 'stroke-ink-faint' : 'stroke-ink-soft'} group-hover/cavity:stroke-ink group-focus-visible/cavity:stroke-focus group-focus-visible/cavity:stroke-[3]`}
      />
      <text x={x + 3} y={y + 8.5} className="fill-ink-soft font-mono text-[8px]">
        {pin.cavity.length > 4 ? `${pin.cavity.slice(0, 4)}…` : pin.cavity}
      </text>
      <PlacedGlyphPath
        disposition={pin.disposition}
        x={x + BOX / 2 - 6}
        y={y + 11}
        scale={1.2}
        className={undecided ? 'text-ink-faint' : 'text-ink'}
      />
    </g>
  );
});

const sameItems = <T,>(a: readonly T[], b: readonly T[]) =>
  a.length === b.length && a.every((item, i) => item === b[i]);

/** Redraw a face only when one of its own pins (or its layout) changed, not on every edit. */
function sameFace(before: FaceProps, after: FaceProps): boolean {
  return (
    before.connector === after.connector &&
    before.unit === after.unit &&
    before.onActivate === after.onActivate &&
    sameItems(before.pins, after.pins) &&
    sameItems(Object.values(before.counts), Object.values(after.counts))
  );
}
