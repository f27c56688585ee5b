/**
 * The bench checklist: the pins a technician works through on a signed-off revision, in the order
 * they are worked, and what a continuity reading should be.
 */
import type { BenchItem } from '../schemas/bench.schema.ts';
import type { ConversionSnapshot, SnapshotPin } from '../schemas/snapshot.schema.ts';
import { BENCH_ORDER } from './dispositions.ts';
import { conductorResistanceOhm } from './electrical/copper.ts';
import { pinNames } from './pin-names.ts';

/** Contact and terminal allowance on top of the wire itself (common practice, no source: ≈0–0.2 Ω for short runs). */
export const CONTINUITY_ALLOWANCE_OHM = 0.2;

export function expectedContinuityOhm(
  pin: Pick<SnapshotPin, 'sizeMm2' | 'runLengthM'>,
): number | null {
  if (pin.sizeMm2 == null || pin.runLengthM == null || pin.runLengthM <= 0) return null;
  return conductorResistanceOhm({ areaMm2: pin.sizeMm2, lengthM: pin.runLengthM });
}

/** A reading above the wire's own resistance plus the allowance needs a second look. */
export function continuityLooksHigh(measuredOhm: number, expectedOhm: number | null): boolean {
  return measuredOhm > (expectedOhm ?? 0) + CONTINUITY_ALLOWANCE_OHM;
}

/** Every pin with something to do or test (empty cavities left out), in bench order. */
export function benchItems(snapshot: ConversionSnapshot): Omit<BenchItem, 'record'>[] {
  const pinName = pinNames(snapshot);
  const feedName = new Map(snapshot.feeds.map((f) => [f.id, f.name]));
  const connectorOrder = new Map(snapshot.connectors.map((c, i) => [c.id, i]));
  return snapshot.pins
    .filter((p) => p.disposition !== 'empty')
    .sort(
      (a, b) =>
        BENCH_ORDER.indexOf(a.disposition) - BENCH_ORDER.indexOf(b.disposition) ||
        connectorOrder.get(a.connectorId)! - connectorOrder.get(b.connectorId)! ||
        a.position - b.position,
    )
    .map((pin) => ({
      pin,
      name: pinName.get(pin.id)!,
      destinationLabel:
        pin.destinationPinId != null
          ? (pinName.get(pin.destinationPinId) ?? '')
          : pin.destinationFeedId != null
            ? `Feed: ${feedName.get(pin.destinationFeedId) ?? '?'}`
            : pin.destination,
      expectedOhm: expectedContinuityOhm(pin),
    }));
}
