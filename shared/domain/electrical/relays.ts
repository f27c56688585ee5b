/**
 * Relays and the ECU outputs that drive them: contacts that survive a motor's or a lamp's inrush,
 * and a coil the driving output can carry.
 */
import { FLOAT_SLACK, requireNonNegative, requirePositive } from './guards.ts';

/** What a load is, for the current its relay contacts see when it switches on. */
export const LOAD_KINDS = ['resistive', 'motor', 'lamp'] as const;
export type LoadKind = (typeof LOAD_KINDS)[number];
export const LOAD_KIND_LABELS: Record<LoadKind, string> = {
  resistive: 'Resistive',
  motor: 'Motor',
  lamp: 'Lamp',
};

/**
 * Contact rating needed per amp of running current: a motor draws several times its running
 * current while it starts and a cold lamp filament many times its hot current, so relay makers
 * rate contacts lower for such loads. ×2 for motors and ×3 for lamps are common practice, no
 * source; a relay maker's own motor or lamp rating, where given, comes first.
 */
export const INRUSH_ALLOWANCE: Readonly<Record<LoadKind, number>> = {
  resistive: 1,
  motor: 2,
  lamp: 3,
};

export interface ContactLoad {
  currentA: number;
  kind?: LoadKind;
}

/** The contact rating the loads need: each load's current times its kind's allowance. */
export function contactRatingNeededA(loads: readonly ContactLoad[]): number {
  let neededA = 0;
  for (const l of loads) {
    requireNonNegative('currentA', l.currentA);
    neededA += l.currentA * INRUSH_ALLOWANCE[l.kind ?? 'resistive'];
  }
  return neededA;
}

/** The ECU output stage that switches a pin. */
export const DRIVER_TYPES = ['low_side', 'high_side', 'push_pull', 'open_collector'] as const;
export type DriverType = (typeof DRIVER_TYPES)[number];
export const DRIVER_TYPE_LABELS: Record<DriverType, string> = {
  low_side: 'Low side (switches ground)',
  high_side: 'High side (switches supply)',
  push_pull: 'Push-pull',
  open_collector: 'Open collector',
};

/** Coil current from its resistance: I = V / R (Ohm's law) [C]. */
export function coilCurrentA(systemV: number, coilResistanceOhm: number): number {
  requirePositive('systemV', systemV);
  requirePositive('coilResistanceOhm', coilResistanceOhm);
  return systemV / coilResistanceOhm;
}

/** True when the output's rated current covers what it drives. */
export function outputCarries(ratedA: number, drawnA: number): boolean {
  requirePositive('ratedA', ratedA);
  requireNonNegative('drawnA', drawnA);
  return drawnA <= ratedA * (1 + FLOAT_SLACK);
}
