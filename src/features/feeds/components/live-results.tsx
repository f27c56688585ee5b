import type { ReactNode } from 'react';
import { AMBIENT_C } from '#shared/domain/electrical/conductor-temperature.ts';
import { recommendedFuseA } from '#shared/domain/electrical/fuses.ts';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import { fuseLabel, num } from '../lib/feed-display.ts';
import { NO_FUSE, type FeedFormValues } from '../lib/feed-form.ts';
import type { LiveCalc } from '../lib/feed-live-calc.ts';

/** Beside the form: what the checks will compute for the feed as typed so far. */
export function LiveResults({
  values,
  live,
  renderLiveResults,
}: {
  values: FeedFormValues;
  live: LiveCalc;
  renderLiveResults: (request: CalcRequestInput) => ReactNode;
}) {
  const totals = live.ok ? live.totals : null;
  const loadFuse =
    totals && totals.nonContinuousA > 0 && totals.totalA > 0
      ? recommendedFuseA(totals.continuousA, totals.nonContinuousA)
      : null;

  return (
    <aside
      aria-label="Live results"
      className="rounded-md border border-rule bg-paper p-4 xl:sticky xl:top-4"
    >
      <h3 className="font-semibold">Live results</h3>
      <p className="mb-2 text-xs text-ink-faint">
        As the checks will see this feed: air at {AMBIENT_C[values.zone]} °C, the ambient Table 5
        assumes {values.zone === 'engine_bay' ? 'in' : 'outside'} the engine bay, and the conductor
        warmed by its load. The drop here is the wire&apos;s own; the checks add the fuse, relay,
        terminals and return path.
      </p>
      {live.ok ? (
        <>
          {live.fuseFrom ? (
            <p className="mb-2 text-sm text-ink-soft">
              Fuse: the {num(live.request.fuseA ?? 0)} A fuse of “{live.fuseFrom}”, upstream.
            </p>
          ) : null}
          {live.request.fuseA === undefined ? (
            <p className="mb-2 text-sm font-semibold text-fault">
              <span aria-hidden>✕ </span>
              {values.fuseA === NO_FUSE
                ? 'No fuse: a fire risk.'
                : 'No fuse chosen yet: the fuse checks wait for one.'}
            </p>
          ) : null}
          {loadFuse !== null ? (
            <p className="mb-2 text-sm text-ink-soft">
              With the non-continuous loads at 100 %, the checks size the fuse at{' '}
              <span className="font-mono">{fuseLabel(loadFuse)}</span>.
            </p>
          ) : null}
          {renderLiveResults(live.request)}
        </>
      ) : (
        <p className="text-sm text-ink-soft">{live.missing}</p>
      )}
    </aside>
  );
}
