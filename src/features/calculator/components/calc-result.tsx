import { FUSE_FAMILIES } from '#shared/domain/electrical/fuses.ts';
import { Fragment, useId, type ReactNode } from 'react';
import type { CircuitCalcResult } from '#shared/domain/electrical/circuit-calc.ts';
import { formatAwgGauge } from '#shared/domain/wire-sizes.ts';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { RingGlyph } from '@/components/ui/severity.tsx';

const num = (n: number, places = 2) => String(Number(n.toFixed(places)));

const fuseText = (a: number, colour: string | null | undefined) =>
  colour ? `${num(a)} A (${colour})` : `${num(a)} A`;

/** A yes/no answer as a glyph and words, never colour alone. */
function Verdict({ ok, yes, no }: { ok: boolean; yes: string; no: string }) {
  return (
    <span
      className={`inline-flex items-center gap-1.5 font-semibold ${ok ? 'text-sound' : 'text-fault'}`}
    >
      <RingGlyph>{ok ? '✓' : '✕'}</RingGlyph>
      {ok ? yes : no}
    </span>
  );
}

function Row({
  term,
  children,
  detail,
  stacked,
}: {
  term: string;
  children: ReactNode;
  detail?: ReactNode;
  /** Term above the figures, for a narrow column. */
  stacked: boolean;
}) {
  return (
    <div
      className={`grid gap-x-4 gap-y-0.5 border-b border-rule/70 py-2 last:border-0 ${stacked ? '' : 'sm:grid-cols-[11rem_1fr]'}`}
    >
      <dt className="text-sm font-medium text-ink-soft">{term}</dt>
      <dd>
        <div>{children}</div>
        {detail ? <div className="mt-0.5 text-sm text-ink-faint">{detail}</div> : null}
      </dd>
    </div>
  );
}

const Mono = ({ children }: { children: ReactNode }) => (
  <span className="font-mono text-[0.9375rem]">{children}</span>
);

/**
 * One calculator answer. "compact" for beside the feed form: the figures a builder decides by, with
 * sources. "full" for the calculator page: also the conductor's working and every note.
 */
export function CalcResultView({
  result,
  request,
  mode = 'full',
}: {
  result: CircuitCalcResult;
  /** The request answered: its fuse, drop limit and conductor temperature are shown beside the figures. */
  request: CalcRequestInput;
  mode?: 'compact' | 'full';
}) {
  const r = result;
  const limitPct = request.dropLimitPct;
  const compact = mode === 'compact';
  const family = FUSE_FAMILIES[request.fuseType ?? 'standard_blade'];
  const headingId = useId();
  const derated = r.deratingFactor !== 1;
  const rowText = `${formatAwgGauge(r.tableAwg)} AWG row, ${r.insulationColumnC} °C column: ${num(r.tableAmpacityA)} A`;
  const factors = [
    r.engineSpaceFactor !== 1 ? `× ${r.engineSpaceFactor} engine bay` : null,
    r.bundleFactor !== 1 ? `× ${r.bundleFactor} bundled` : null,
  ].filter(Boolean);
  const minDrop = r.minSizeForDrop;
  // The request's own series first.
  const byAwg = request.awg !== undefined;
  const dropSizes = minDrop
    ? byAwg
      ? [minDrop.awg, minDrop.mm2]
      : [minDrop.mm2, minDrop.awg]
    : [];
  const ownDrop = dropSizes[0] ?? null;
  return (
    <div>
      <dl>
        <Row
          stacked={compact}
          term="Voltage drop"
          detail={
            !compact
              ? `${num(r.conductorLengthM)} m of conductor, ${num(r.resistanceOhm, 4)} Ω at ${num(r.conductorTempC, 1)} °C (${r.conductorTempEstimated ? `estimated from the load in ${num(r.ambientC)} °C air` : 'as measured'})`
              : undefined
          }
        >
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <Mono>
              {num(r.voltageDropV, 3)} V · {num(r.voltageDropPct)} %
            </Mono>
            {r.dropWithinLimit !== undefined && limitPct !== undefined ? (
              <Verdict
                ok={r.dropWithinLimit}
                yes={`within the ${num(limitPct)} % limit`}
                no={`over the ${num(limitPct)} % limit`}
              />
            ) : null}
          </span>
        </Row>
        <Row
          stacked={compact}
          term="Ampacity, derated"
          detail={
            <>
              Table 5 {rowText}
              {factors.length ? ` ${factors.join(' ')}` : ''}
              {r.extrapolated
                ? r.tableAwg === 18
                  ? ' (scaled down by area: thinner than the table)'
                  : ' (rated as 4/0 AWG: thicker than the table)'
                : ''}
            </>
          }
        >
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <Mono>{num(r.ampacityA, 1)} A</Mono>
            {derated ? (
              <span className="text-sm text-ink-faint">factor {num(r.deratingFactor, 3)}</span>
            ) : null}
            <Verdict ok={r.currentWithinAmpacity} yes="carries the load" no="load exceeds it" />
          </span>
        </Row>
        <Row stacked={compact} term="Fuse protects the wire">
          {r.fuseProtectsWire === undefined ? (
            <span className="text-ink-faint">No fuse given</span>
          ) : (
            <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <Verdict ok={r.fuseProtectsWire} yes="yes" no="no" />
              <span className="text-sm text-ink-soft">
                <Mono>
                  {fuseText(request.fuseA ?? 0, r.fuseColour)} {r.fuseProtectsWire ? '≤' : '>'}{' '}
                  {num(r.ampacityA, 1)} A
                </Mono>
              </span>
            </span>
          )}
        </Row>
        <Row
          stacked={compact}
          term="Recommended fuse"
          detail={`For the load taken as continuous: 125 % of it, the next ${family.label.toLowerCase()} rating.`}
        >
          {r.recommendedFuseA === null ? (
            <span>
              {family.ratings.length
                ? `More than the largest ${family.label.toLowerCase()} (${family.ratings.at(-1)!.ratingA} A)`
                : 'The rating its maker states'}
            </span>
          ) : (
            <Mono>{fuseText(r.recommendedFuseA, r.recommendedFuseColour)}</Mono>
          )}
        </Row>
        <Row stacked={compact} term="Smallest wire for the fuse">
          {r.smallestWireForFuse ? (
            <span>
              <Mono>{r.smallestWireForFuse.label}</Mono>{' '}
              <span className="text-sm text-ink-faint">
                rated {num(r.smallestWireForFuse.ampacityA, 1)} A
                {r.smallestWireForFuse.extrapolated ? ', scaled below the table' : ''}
              </span>
            </span>
          ) : (
            <span className="text-ink-faint">
              {r.recommendedFuseA === null && r.fuseProtectsWire === undefined
                ? 'No fuse to size for'
                : 'No listed size is enough'}
            </span>
          )}
        </Row>
        {minDrop ? (
          <Row stacked={compact} term="Smallest size for the drop limit">
            {minDrop.mm2 || minDrop.awg ? (
              <span className="flex flex-wrap gap-x-2">
                {dropSizes.map((size, i) => (
                  <Fragment key={i}>
                    {i > 0 ? (
                      <span aria-hidden className="text-ink-faint">
                        ·
                      </span>
                    ) : null}
                    <Mono>{size?.label ?? '—'}</Mono>
                  </Fragment>
                ))}
                {ownDrop ? (
                  <span className="text-sm text-ink-faint">
                    {num(ownDrop.voltageDropPct)} % in {ownDrop.label}
                  </span>
                ) : null}
              </span>
            ) : (
              <span>No listed size keeps the drop within the limit: shorten the run.</span>
            )}
          </Row>
        ) : null}
      </dl>

      {!compact ? (
        <section aria-labelledby={`${headingId}-notes`} className="mt-5">
          <h3 id={`${headingId}-notes`} className="mb-2 font-semibold">
            Working and notes
          </h3>
          <ol className="list-decimal space-y-1 pl-5 text-sm text-ink-soft marker:text-ink-faint">
            <li>
              Area <span className="font-mono">{num(r.areaMm2, 3)} mm²</span> ({r.sizeLabel});
              conductor length <span className="font-mono">{num(r.conductorLengthM)} m</span>;
              resistance <span className="font-mono">{num(r.resistanceOhm, 4)} Ω</span>.
            </li>
            {r.notes.map((note, i) => (
              <li key={i}>{note}</li>
            ))}
          </ol>
        </section>
      ) : null}

      {compact ? (
        <div className="mt-3 text-sm">
          <p className="text-ink-soft">
            <span className="font-semibold text-ink">Sources: </span>
            {r.sources.map((s) => s.title).join(' · ')}
          </p>
          <details className="mt-1">
            <summary className="cursor-pointer text-ink-faint hover:text-ink">
              Citations and notes
            </summary>
            <ul className="mt-1 space-y-1 text-ink-faint">
              {r.sources.map((s) => (
                <li key={s.id}>
                  <span className="font-medium text-ink-soft">{s.title}</span> — {s.citation}
                </li>
              ))}
              {r.notes.map((note, i) => (
                <li key={`note-${i}`}>{note}</li>
              ))}
            </ul>
          </details>
        </div>
      ) : (
        <section aria-labelledby={`${headingId}-sources`} className="mt-5">
          <h3 id={`${headingId}-sources`} className="mb-2 font-semibold">
            Sources
          </h3>
          <ul className="space-y-1 text-sm">
            {r.sources.map((s) => (
              <li key={s.id}>
                <span className="font-medium text-ink">{s.title}</span>
                <span className="text-ink-faint"> — {s.citation}</span>
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
