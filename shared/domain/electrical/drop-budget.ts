/**
 * The whole drop budget of a feed: the copper is only part of it. A fuse, relay contacts, every
 * crimped terminal and splice and a chassis return each take a share of the same allowance.
 */
import { FLOAT_SLACK, requireNonNegative, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';
import type { ReturnPath } from './voltage-drop.ts';

/**
 * What each part of a circuit drops, volts; a workshop can change every one. A fuse and a set of
 * relay contacts are resistances, so their figure is at their rating and scales with the current
 * through them; a terminal and the chassis are taken as fixed.
 */
export interface DropAllowances {
  /** Across one fuse and its holder, at the fuse's rating. */
  fuseV: number;
  /** Across a closed relay's contacts, at their rating. */
  relayContactsV: number;
  /** Per crimped terminal or splice along the feed. */
  perConnectionV: number;
  /** A chassis return: body, straps and studs between the load's ground and the battery. */
  chassisReturnV: number;
}

/**
 * Defaults. The fuse figure is from memory (blade-fuse makers' datasheets list roughly 0.1 V across
 * a fuse at its rating); the others are common practice, no source. A shop that measures its own
 * parts should put its figures in the workshop settings.
 */
export const DEFAULT_DROP_ALLOWANCES: Readonly<DropAllowances> = {
  fuseV: 0.1,
  relayContactsV: 0.1,
  perConnectionV: 0.005,
  chassisReturnV: 0.05,
};

export const DROP_ALLOWANCE_SOURCES: Readonly<Record<keyof DropAllowances, SourceId>> = {
  fuseV: 'from-memory',
  relayContactsV: 'common-practice',
  perConnectionV: 'common-practice',
  chassisReturnV: 'common-practice',
};

/** Crimped terminals and splices counted on a feed when none is recorded (common practice). */
export const DEFAULT_CONNECTIONS = 4;

export interface DropBudgetInput {
  /** Drop in this feed's own wire, V. */
  copperV: number;
  /** Drops in the wires of the feeds up the chain of relay outputs, V, nearest first. */
  upstream?: ReadonlyArray<{ name: string; copperV: number }>;
  /** Fuses on the path: each one's rating and the current through it, A. */
  fuses: ReadonlyArray<{ ratingA: number; currentA: number }>;
  /** Relay contact sets on the path: each one's contact rating and the current through it, A. */
  relays: ReadonlyArray<{ ratingA: number; currentA: number }>;
  /** Crimped terminals and splices. */
  connections: number;
  returnPath: ReturnPath;
  allowances: DropAllowances;
  systemV: number;
  limitPct: number;
}

export interface DropBudgetLine {
  label: string;
  volts: number;
  source: SourceId;
}

export interface DropBudget {
  lines: DropBudgetLine[];
  totalV: number;
  totalPct: number;
  limitV: number;
  /** What is left of the limit for this feed's own copper, V (may be below zero). */
  copperAllowanceV: number;
  withinLimit: boolean;
}

const r3 = (n: number) => String(Number(n.toFixed(3)));

export function dropBudget(input: DropBudgetInput): DropBudget {
  const { allowances: a, systemV, limitPct } = input;
  requireNonNegative('copperV', input.copperV);
  requirePositive('systemV', systemV);
  requirePositive('limitPct', limitPct);
  const lines: DropBudgetLine[] = [
    { label: 'Wire of this feed', volts: input.copperV, source: 'iacs-copper' },
  ];
  for (const up of input.upstream ?? []) {
    lines.push({
      label: `Wire of "${up.name}" upstream`,
      volts: up.copperV,
      source: 'iacs-copper',
    });
  }
  // A fuse or a set of contacts drops its figure at its rating, in proportion below it.
  const scaled = (
    parts: DropBudgetInput['fuses'],
    name: string,
    key: 'fuseV' | 'relayContactsV',
  ) => {
    for (const p of parts) {
      requirePositive('ratingA', p.ratingA);
      lines.push({
        label: `${name} ${r3(p.ratingA)} A at ${r3(p.currentA)} A: ${r3(a[key])} V × ${r3(p.currentA)} / ${r3(p.ratingA)}`,
        volts: (a[key] * p.currentA) / p.ratingA,
        source: DROP_ALLOWANCE_SOURCES[key],
      });
    }
  };
  scaled(input.fuses, 'Fuse', 'fuseV');
  scaled(input.relays, 'Relay contacts', 'relayContactsV');
  if (input.connections > 0) {
    lines.push({
      label: `${input.connections} × terminal or splice at ${r3(a.perConnectionV)} V`,
      volts: input.connections * a.perConnectionV,
      source: DROP_ALLOWANCE_SOURCES.perConnectionV,
    });
  }
  if (input.returnPath === 'chassis') {
    lines.push({
      label: 'Chassis return',
      volts: a.chassisReturnV,
      source: DROP_ALLOWANCE_SOURCES.chassisReturnV,
    });
  }
  const totalV = lines.reduce((sum, l) => sum + l.volts, 0);
  const limitV = (limitPct / 100) * systemV;
  const otherV = totalV - input.copperV;
  return {
    lines,
    totalV,
    totalPct: (totalV / systemV) * 100,
    limitV,
    copperAllowanceV: limitV - otherV,
    withinLimit: totalV <= limitV * (1 + FLOAT_SLACK),
  };
}

/** The budget as working lines: one per part, then the total against the limit. */
export function dropBudgetWorking(b: DropBudget, systemV: number, limitPct: number): string[] {
  return [
    ...b.lines.map((l) => `${l.label}: ${r3(l.volts)} V`),
    `Total ${r3(b.totalV)} V = ${Number(b.totalPct.toFixed(2))} % of ${systemV} V; the limit is ${limitPct} % = ${r3(b.limitV)} V`,
  ];
}
