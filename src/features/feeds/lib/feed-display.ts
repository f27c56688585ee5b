/** How a feed reads in the table and the pickers: fuse colours, sources, pins, check results. */
import { cavityName } from '#shared/domain/pin-names.ts';
import {
  DEFAULT_FUSE_TYPE,
  FUSE_FAMILIES,
  fuseColour,
  isStandardFuseRating,
  type FuseType,
} from '#shared/domain/electrical/fuses.ts';
import { SEVERITIES, type Finding, type Severity } from '#shared/schemas/checks.schema.ts';
import { FEED_SOURCE_LABELS, type Feed } from '#shared/schemas/feeds.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';

/** "15 A (blue)"; a rating that is not a blade fuse has no printed colour to give. */
export function fuseLabel(fuseA: number, type: FuseType = DEFAULT_FUSE_TYPE): string {
  const colour = fuseColour(fuseA, type);
  if (colour) return `${fuseA} A (${colour})`;
  return isStandardFuseRating(fuseA, type)
    ? `${fuseA} A`
    : `${fuseA} A (not a ${FUSE_FAMILIES[type].label.toLowerCase()} rating)`;
}

export function sourceLabel(feed: Pick<Feed, 'source' | 'sourceFeedId'>, feeds: Feed[]): string {
  if (feed.source !== 'relay_output') return FEED_SOURCE_LABELS[feed.source];
  const from = feeds.find((f) => f.id === feed.sourceFeedId);
  return from ? `Relay output of “${from.name}”` : FEED_SOURCE_LABELS.relay_output;
}

export interface PinChoice {
  id: number;
  /** "E2-9": connector label and cavity. */
  name: string;
  /** "E2-9 Fuel pump relay coil control". */
  label: string;
  connectorLabel: string;
}

/** Every pin as a picker offers it, connector by connector in face order. */
export function pinChoices(pins: readonly Pin[], connectors: readonly Connector[]): PinChoice[] {
  const byId = new Map(connectors.map((c) => [c.id, c]));
  const order = new Map(connectors.map((c, i) => [c.id, i]));
  return [...pins]
    .sort(
      (a, b) =>
        (order.get(a.connectorId) ?? 0) - (order.get(b.connectorId) ?? 0) ||
        a.position - b.position,
    )
    .map((p) => {
      const connectorLabel = byId.get(p.connectorId)?.label ?? '?';
      const name = cavityName(connectorLabel, p.cavity);
      const fn = p.function.trim();
      return { id: p.id, name, label: fn ? `${name} ${fn}` : name, connectorLabel };
    });
}

export function totalLoadA(feed: Pick<Feed, 'loads'>): { totalA: number; continuousA: number } {
  let totalA = 0;
  let continuousA = 0;
  for (const l of feed.loads) {
    totalA += l.currentA;
    if (l.continuous) continuousA += l.currentA;
  }
  return { totalA, continuousA };
}

/** A number as the workshop reads it: no trailing zeros, at most two places. */
export const num = (n: number, places = 2) => String(Number(n.toFixed(places)));

/** SEVERITIES lists the worst first. */
const rank = (severity: Severity) => SEVERITIES.indexOf(severity);

/** The findings about each feed, worst first. */
export function findingsByFeed(findings: readonly Finding[]): Map<number, Finding[]> {
  const map = new Map<number, Finding[]>();
  for (const f of findings) {
    const feedId = f.subject.feedId;
    if (feedId == null) continue;
    const list = map.get(feedId) ?? [];
    list.push(f);
    map.set(feedId, list);
  }
  for (const list of map.values()) list.sort((a, b) => rank(a.severity) - rank(b.severity));
  return map;
}

/** For sorting the table by its check column: worst severity first, clean feeds last. */
export function worstRank(findings: readonly Finding[] | undefined): number {
  if (!findings?.length) return SEVERITIES.length;
  return Math.min(...findings.map((f) => rank(f.severity)));
}
