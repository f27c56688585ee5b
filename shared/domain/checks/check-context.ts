/**
 * Lookups the rules share: pins, connectors and feeds by id, which fuse protects each feed, and the
 * current each feed carries (its own loads and those of the feeds its relay powers; feed-chain.ts).
 */
import type { Finding, FindingValue } from '../../schemas/checks.schema.ts';
import type { SizeUnit } from '../../schemas/workshop.schema.ts';
import type {
  ConversionSnapshot,
  SnapshotConnector,
  SnapshotFeed,
  SnapshotPin,
} from '../../schemas/snapshot.schema.ts';
import type { DropAllowances } from '../electrical/drop-budget.ts';
import { citeSources, type SourceId } from '../electrical/sources.ts';
import { cavityName } from '../pin-names.ts';
import { FeedChain, type FeedCurrent, type ProtectingFuse } from './feed-chain.ts';
import { sizeMark } from './finding-sizes.ts';

export interface CheckOptions {
  /** The workshop's unit: the series sizes are suggested from, and the unit findings are shown in. */
  sizeUnit: SizeUnit;
  /** The workshop's drop allowances (drop-budget.ts); the defaults when not given. */
  dropAllowances?: DropAllowances;
}

export type { FeedCurrent, ProtectingFuse };

export class CheckContext {
  readonly pins = new Map<number, SnapshotPin>();
  readonly connectors = new Map<number, SnapshotConnector>();
  readonly feeds: Map<number, SnapshotFeed>;
  private readonly chain: FeedChain<SnapshotFeed>;

  constructor(
    readonly snapshot: ConversionSnapshot,
    readonly options: CheckOptions,
  ) {
    for (const c of snapshot.connectors) this.connectors.set(c.id, c);
    for (const p of snapshot.pins) this.pins.set(p.id, p);
    this.chain = new FeedChain(snapshot.feeds);
    this.feeds = this.chain.feeds;
  }

  get systemV(): number {
    return this.snapshot.conversion.systemVoltage;
  }

  /** "E2-5": connector label and cavity. */
  pinName(pinOrId: SnapshotPin | number): string {
    const pin = typeof pinOrId === 'number' ? this.pins.get(pinOrId) : pinOrId;
    if (!pin) return `pin ${String(pinOrId)}`;
    return cavityName(this.connectors.get(pin.connectorId)?.label ?? '?', pin.cavity);
  }

  /** A size as findings keep it: a number, written in a unit only when shown (finding-sizes.ts). */
  size(areaMm2: number): string {
    return sizeMark(areaMm2);
  }

  /** The fuse that protects a feed's wire (feed-chain.ts). */
  protectingFuse(feed: SnapshotFeed): ProtectingFuse | null {
    return this.chain.protectingFuse(feed);
  }

  /** The feed and every feed up its chain of relay outputs, nearest first (feed-chain.ts). */
  pathToSource(feed: SnapshotFeed): SnapshotFeed[] {
    return this.chain.pathToSource(feed);
  }

  /** The current through a feed's fuse and wire (feed-chain.ts). */
  current(feed: SnapshotFeed): FeedCurrent {
    return this.chain.current(feed);
  }
}

const round = (n: number, places = 2) => Number(n.toFixed(places));

export function value(
  label: string,
  v: number | string | boolean | null,
  unit?: string,
  places = 2,
): FindingValue {
  return { label, value: typeof v === 'number' ? round(v, places) : v, ...(unit ? { unit } : {}) };
}

/** Builds a finding with its sources cited once and joined into one line. */
export function finding(
  f: Omit<Finding, 'id' | 'source' | 'sources'> & { sourceIds: SourceId[] },
): Finding {
  const { sourceIds, ...rest } = f;
  const sources = citeSources(sourceIds);
  const subjectKey =
    rest.subject.feedId != null
      ? `feed-${rest.subject.feedId}`
      : `pins-${(rest.subject.pinIds ?? []).join('.')}`;
  return {
    id: `${rest.rule}:${subjectKey}`,
    ...rest,
    source: sources.map((s) => s.citation).join('; '),
    sources,
  };
}

export const fmt = (n: number, places = 2) => String(round(n, places));
