/** How far the mapping has got: pins counted by disposition, per connector and overall. */
import { DISPOSITIONS, type Disposition } from '#shared/domain/dispositions.ts';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';

export type DispositionCounts = Record<Disposition, number>;

export function countDispositions(pins: readonly Pin[]): DispositionCounts {
  const counts = Object.fromEntries(DISPOSITIONS.map((d) => [d, 0])) as DispositionCounts;
  for (const pin of pins) counts[pin.disposition]++;
  return counts;
}

/** Each connector's pins, in the order given. */
export function pinsByConnector(pins: readonly Pin[]): Map<number, Pin[]> {
  const groups = new Map<number, Pin[]>();
  for (const pin of pins) {
    const group = groups.get(pin.connectorId);
    if (group) group.push(pin);
    else groups.set(pin.connectorId, [pin]);
  }
  return groups;
}

export function countsByConnector(pins: readonly Pin[]): Map<number, DispositionCounts> {
  return new Map([...pinsByConnector(pins)].map(([id, group]) => [id, countDispositions(group)]));
}

export function totalOf(counts: DispositionCounts): number {
  return DISPOSITIONS.reduce((sum, d) => sum + counts[d], 0);
}

export function decidedOf(counts: DispositionCounts): number {
  return totalOf(counts) - counts.undecided;
}
