/**
 * Who powers whom among a conversion's new feeds: the fuse that protects each feed's wire and the
 * current each feed carries. The checks and the feed form's live calculation both read it, so the
 * form shows what the checks will find.
 */

/** What the chain needs of a feed. */
export interface ChainFeed {
  id: number;
  source: 'battery' | 'ignition' | 'relay_output';
  sourceFeedId: number | null;
  fuseA: number | null;
  loads: ReadonlyArray<{ currentA: number; continuous: boolean }>;
}

export interface FeedCurrent {
  continuousA: number;
  nonContinuousA: number;
  totalA: number;
  /** Feeds (this one first) whose loads make up the total. */
  feedIds: number[];
}

export interface ProtectingFuse {
  fuseA: number;
  /** The feed whose fuse it is: this feed, or one up the chain of relay outputs. */
  feedId: number;
}

export class FeedChain<F extends ChainFeed = ChainFeed> {
  readonly feeds = new Map<number, F>();
  private readonly poweredBy = new Map<number, F[]>();

  constructor(feeds: readonly F[]) {
    for (const f of feeds) this.feeds.set(f.id, f);
    for (const f of feeds) {
      if (f.source === 'relay_output' && f.sourceFeedId != null) {
        const list = this.poweredBy.get(f.sourceFeedId) ?? [];
        list.push(f);
        this.poweredBy.set(f.sourceFeedId, list);
      }
    }
  }

  /**
   * The fuse that protects a feed's wire: its own, else the nearest one up the chain of relay
   * outputs. Null when the chain reaches the battery or ignition without a fuse.
   */
  protectingFuse(feed: ChainFeed): ProtectingFuse | null {
    const seen = new Set<number>();
    for (let at: ChainFeed | undefined = feed; at && !seen.has(at.id);) {
      seen.add(at.id);
      if (at.fuseA != null) return { fuseA: at.fuseA, feedId: at.id };
      if (at.source !== 'relay_output' || at.sourceFeedId == null) return null;
      at = this.feeds.get(at.sourceFeedId);
    }
    return null;
  }

  /** The feed and every feed up its chain of relay outputs, nearest first; stops at a loop. */
  pathToSource(feed: F): F[] {
    const path: F[] = [];
    for (let at: F | undefined = feed; at && !path.includes(at);) {
      path.push(at);
      if (at.source !== 'relay_output' || at.sourceFeedId == null) break;
      at = this.feeds.get(at.sourceFeedId);
    }
    return path;
  }

  /** The current through a feed's fuse and wire: its loads plus those of every feed it powers. */
  current(feed: ChainFeed): FeedCurrent {
    const result: FeedCurrent = { continuousA: 0, nonContinuousA: 0, totalA: 0, feedIds: [] };
    const visit = (f: ChainFeed) => {
      if (result.feedIds.includes(f.id)) return;
      result.feedIds.push(f.id);
      for (const load of f.loads) {
        if (load.continuous) result.continuousA += load.currentA;
        else result.nonContinuousA += load.currentA;
      }
      for (const downstream of this.poweredBy.get(f.id) ?? []) visit(downstream);
    };
    visit(feed);
    result.totalA = result.continuousA + result.nonContinuousA;
    return result;
  }
}
