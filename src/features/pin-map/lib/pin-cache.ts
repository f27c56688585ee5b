/**
 * Pure updates of the cached list of pins, for optimistic edits: pins that do not change keep
 * their identity, so rows that did not change are not redrawn.
 */
import type { Pin, PinChanges, PinFields } from '#shared/schemas/pin-map.schema.ts';
import type { PinEdit } from './pin-edits.ts';

/** The pins with the edits' values applied (versions untouched: the server assigns those). */
export function applyEdits(pins: readonly Pin[], edits: readonly PinEdit[]): Pin[] {
  if (edits.length === 0) return [...pins];
  const byId = new Map<number, PinEdit['set']>();
  for (const e of edits) byId.set(e.id, { ...byId.get(e.id), ...e.set });
  return pins.map((p) => {
    const set = byId.get(p.id);
    return set ? { ...p, ...set } : p;
  });
}

/** The pins with the server's copies put in place of their old rows. */
export function replacePins(pins: readonly Pin[], fresh: readonly Pin[]): Pin[] {
  if (fresh.length === 0) return [...pins];
  const byId = new Map(fresh.map((p) => [p.id, p]));
  return pins.map((p) => byId.get(p.id) ?? p);
}

export function pinsById(pins: readonly Pin[]): Map<number, Pin> {
  return new Map(pins.map((p) => [p.id, p]));
}

/** The pin's present values of the fields a change sets: what putting the pin back takes. */
export function valuesBefore(pin: Pin, set: PinChanges): PinChanges {
  return Object.fromEntries(
    Object.keys(set).map((k) => [k, pin[k as keyof PinFields]]),
  ) as PinChanges;
}
