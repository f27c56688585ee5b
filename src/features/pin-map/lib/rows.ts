import { cavityName } from '#shared/domain/pin-names.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';

/** A pin as the grid shows it: with its connector's label and the name it goes by ("E1-5"). */
export interface PinRow {
  pin: Pin;
  connectorLabel: string;
  name: string;
  /**
   * "V1-3" when the destination is linked to a vehicle-side cavity, "Feed: ECU main" when the pin
   * joins a new feed, otherwise ''.
   */
  linkedDestination: string;
}

/** A new fused feed of the conversion that a pin can join; named as the grid writes it. */
export interface DestinationFeed {
  feedId: number;
  name: string;
}

/** "Feed: ECU main": how a joined feed reads in the destination column, and how it is typed. */
export const feedDestination = (name: string) => `Feed: ${name}`;

/** A cavity of a vehicle-side connector that a pin's destination can be linked to. */
export interface DestinationCavity {
  pinId: number;
  name: string;
  function: string;
}

/** Connector labels by id; a pin whose connector is gone (mid-refetch) shows "?". */
export function connectorLabels(connectors: readonly Connector[]): Map<number, string> {
  return new Map(connectors.map((c) => [c.id, c.label]));
}

export function nameOfPin(pin: Pin, labels: Map<number, string>): string {
  return cavityName(labels.get(pin.connectorId) ?? '?', pin.cavity);
}

/** The cavities of vehicle-side connectors, in connector and face order. */
export function destinationCavities(
  pins: readonly Pin[],
  connectors: readonly Connector[],
): DestinationCavity[] {
  const vehicle = new Map(connectors.filter((c) => c.side === 'vehicle').map((c) => [c.id, c]));
  return pins
    .filter((p) => vehicle.has(p.connectorId))
    .map((p) => ({
      pinId: p.id,
      name: cavityName(vehicle.get(p.connectorId)!.label, p.cavity),
      function: p.function,
    }));
}

// The last row made for each pin object. An edit replaces only the pins it touches, so reusing
// the rows of untouched pins lets the grid skip redrawing them; the output is the same either way.
const madeRows = new WeakMap<Pin, PinRow>();

/** Grid rows for the pins, keeping the server's order (connector, then face position). */
export function toPinRows(
  pins: readonly Pin[],
  connectors: readonly Connector[],
  feeds: readonly DestinationFeed[] = [],
): PinRow[] {
  const labels = connectorLabels(connectors);
  const names = new Map(pins.map((p) => [p.id, nameOfPin(p, labels)]));
  const feedNames = new Map(feeds.map((f) => [f.feedId, f.name]));
  const linked = (pin: Pin) => {
    if (pin.destinationPinId != null) return names.get(pin.destinationPinId) ?? '(removed cavity)';
    if (pin.destinationFeedId != null)
      return feedDestination(feedNames.get(pin.destinationFeedId) ?? `#${pin.destinationFeedId}`);
    return '';
  };
  return pins.map((pin) => {
    const row: PinRow = {
      pin,
      connectorLabel: labels.get(pin.connectorId) ?? '?',
      name: names.get(pin.id)!,
      linkedDestination: linked(pin),
    };
    const made = madeRows.get(pin);
    if (
      made &&
      made.connectorLabel === row.connectorLabel &&
      made.name === row.name &&
      made.linkedDestination === row.linkedDestination
    ) {
      return made;
    }
    madeRows.set(pin, row);
    return row;
  });
}
