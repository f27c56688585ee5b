/**
 * The live calculation beside the feed form: what the checks will compute for the feed as typed,
 * from the same feed chain the checks use. Pure, so it is unit-tested in node.
 */
import { FeedChain } from '#shared/domain/checks/feed-chain.ts';
import { DROP_LIMIT_PCT } from '#shared/domain/electrical/voltage-drop.ts';
import { exactAwg, exactIsoSize, parseWireSize } from '#shared/domain/wire-sizes.ts';
import type { CalcRequestInput } from '#shared/schemas/calc.schema.ts';
import type { FeedSource } from '#shared/schemas/feeds.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { NO_FUSE, readId, readNumber, type FeedFormValues } from './feed-form.ts';

/** A feed as the live calculation needs it: its loads, wire, fuse and who powers whom. */
export interface FeedLike {
  id: number;
  name: string;
  source: FeedSource;
  sourceFeedId: number | null;
  fuseA: number | null;
  loads: Array<{ currentA: number; continuous: boolean }>;
}

export interface LoadTotals {
  continuousA: number;
  nonContinuousA: number;
  totalA: number;
}

/** Sums the load rows that hold a number; unreadable rows count as nothing. */
export function loadTotals(loads: Array<{ currentA: string; continuous: boolean }>): LoadTotals {
  let continuousA = 0;
  let nonContinuousA = 0;
  for (const l of loads) {
    const read = readNumber(l.currentA);
    if (!read.ok || read.value === null || read.value < 0) continue;
    if (l.continuous) continuousA += read.value;
    else nonContinuousA += read.value;
  }
  return { continuousA, nonContinuousA, totalA: continuousA + nonContinuousA };
}

/** The loads of every feed a feed's relay powers, down the chain, counted as the checks count them. */
function downstreamTotals(feedId: number | null, feeds: readonly FeedLike[]): LoadTotals {
  if (feedId === null) return { continuousA: 0, nonContinuousA: 0, totalA: 0 };
  // The feed itself without loads: the form counts its own loads as typed, not as saved.
  const { continuousA, nonContinuousA, totalA } = new FeedChain(feeds).current({
    id: feedId,
    source: 'battery',
    sourceFeedId: null,
    fuseA: null,
    loads: [],
  });
  return { continuousA, nonContinuousA, totalA };
}

/** The fuse that protects a relay output's wire: the nearest up its chain of relay outputs. */
export function upstreamFuse(
  sourceFeedId: number | null,
  feeds: readonly FeedLike[],
): { fuseA: number; feedName: string } | null {
  if (sourceFeedId == null) return null;
  const chain = new FeedChain(feeds);
  const source = chain.feeds.get(sourceFeedId);
  const fuse = source ? chain.protectingFuse(source) : null;
  return fuse && { fuseA: fuse.fuseA, feedName: chain.feeds.get(fuse.feedId)!.name };
}

export type LiveCalc =
  | {
      ok: true;
      request: CalcRequestInput;
      totals: LoadTotals;
      /** Set when the fuse is another feed's, up the chain. */
      fuseFrom: string | null;
    }
  | { ok: false; missing: string };

/**
 * The calculator request that mirrors what the checks will compute for this feed: the current of
 * its loads and of the feeds its relay powers, the conductor at the ambient Table 5 assumes for the
 * zone, the protecting fuse, the drop limit of its class, and the bundle count (both apply the
 * bundle factors from three conductors up).
 */
export function formToCalcRequest(
  values: FeedFormValues,
  unit: SizeUnit,
  context: { systemV: number; feedId: number | null; feeds: readonly FeedLike[] },
): LiveCalc {
  const own = loadTotals(values.loads);
  const below = downstreamTotals(context.feedId, context.feeds);
  const totals = {
    continuousA: own.continuousA + below.continuousA,
    nonContinuousA: own.nonContinuousA + below.nonContinuousA,
    totalA: own.totalA + below.totalA,
  };
  if (!(totals.totalA > 0)) return { ok: false, missing: 'Add a load with its current.' };

  const size = parseWireSize(values.wireSize, unit);
  if (!size.ok || size.areaMm2 === null) return { ok: false, missing: 'Enter the wire size.' };
  const iso = exactIsoSize(size.areaMm2);
  const gauge = exactAwg(size.areaMm2);

  const length = readNumber(values.lengthM);
  if (!length.ok || length.value === null || !(length.value > 0)) {
    return { ok: false, missing: 'Enter the one-way length of the run.' };
  }

  const ownFuse = readNumber(values.fuseA === NO_FUSE ? '' : values.fuseA);
  let fuseA: number | undefined =
    ownFuse.ok && ownFuse.value !== null && ownFuse.value > 0 ? ownFuse.value : undefined;
  let fuseFrom: string | null = null;
  if (fuseA === undefined && values.source === 'relay_output') {
    const upstream = upstreamFuse(readId(values.sourceFeedId), context.feeds);
    if (upstream) {
      fuseA = upstream.fuseA;
      fuseFrom = upstream.feedName;
    }
  }

  const override = readNumber(values.dropLimitPct);
  const dropLimitPct =
    override.ok && override.value !== null && override.value > 0
      ? override.value
      : DROP_LIMIT_PCT[values.dropClass];

  const bundled = readNumber(values.bundled);
  const request: CalcRequestInput = {
    currentA: Number(totals.totalA.toFixed(4)),
    lengthM: length.value,
    systemV: context.systemV,
    ...(iso !== null ? { sizeMm2: iso } : { awg: gauge ?? undefined }),
    returnPath: values.returnPath,
    insulationRatingC: Number(values.insulationRatingC),
    zone: values.zone,
    bundled: bundled.ok && bundled.value !== null && bundled.value >= 1 ? bundled.value : 1,
    ...(fuseA !== undefined && { fuseA }),
    dropLimitPct,
    fuseType: values.fuseType,
  };
  return {
    ok: true,
    request,
    totals,
    fuseFrom,
  };
}
