/**
 * Runs every rule over a snapshot of a conversion. Pure: the server calls it on the live plan and
 * on a revision's frozen snapshot alike, so a revision's findings can be recomputed and compared.
 */
import type { CheckReport, Finding, Severity } from '../../schemas/checks.schema.ts';
import type { ConversionSnapshot } from '../../schemas/snapshot.schema.ts';
import type { SizeUnit } from '../../schemas/workshop.schema.ts';
import { CheckContext, type CheckOptions } from './check-context.ts';
import { checkFeed } from './feed-rules.ts';
import {
  checkCanTerminations,
  checkCoilSupplies,
  checkEcuPowerAndGrounds,
  checkFuelPump,
  checkLampOutputs,
  checkPulseSignals,
  checkRegulatedCircuits,
  checkSensorReferences,
  checkShields,
} from './signal-rules.ts';
import {
  checkCanPairs,
  checkCanStubs,
  checkCrankCamWiring,
  checkDiagnosticConnector,
  checkEcuMainPower,
  checkPedalTracks,
} from './signal-wiring-rules.ts';
import {
  cavitiesWithTwoWires,
  groundPinsKept,
  harnessGraph,
  powerPinsByWire,
  sensorGroundsByWire,
  spliceWiresProtected,
  unresolvedEnds,
} from './harness-rules.ts';
import { showFinding } from './finding-sizes.ts';
import {
  checkEcuOutputs,
  checkJoinedPins,
  checkSensorGrounds,
  checkSharedDestinations,
  checkUndecided,
} from './pin-rules.ts';

const ORDER: Record<Severity, number> = { error: 0, warning: 1, note: 2 };

/**
 * Every finding as stored with a revision: sizes kept as numbers (finding-sizes.ts), so the
 * findings can be shown in any unit later.
 */
export function storedFindings(snapshot: ConversionSnapshot, options: CheckOptions): Finding[] {
  const ctx = new CheckContext(snapshot, options);
  const graph = harnessGraph(ctx);
  const byWire = graph ? sensorGroundsByWire(ctx, graph) : [];
  // A sensor ground that is wired is judged by its wires; one that is not, by its destination.
  const wiredPins = new Set(
    graph ? snapshot.pins.filter((p) => graph.isWired(p.id)).map((p) => p.id) : [],
  );
  const found = [
    ...checkUndecided(ctx),
    ...snapshot.feeds.flatMap((feed) => checkFeed(ctx, feed)),
    ...checkJoinedPins(ctx),
    ...checkEcuOutputs(ctx),
    ...checkSensorGrounds(ctx).filter(
      (f) => !(f.subject.pinIds ?? []).some((id) => wiredPins.has(id)),
    ),
    ...byWire,
    ...checkSharedDestinations(ctx),
    ...groundPinsKept(ctx),
    ...checkPulseSignals(ctx, graph),
    ...checkCanTerminations(ctx, graph),
    ...checkShields(ctx, graph),
    ...checkSensorReferences(ctx, graph),
    ...checkRegulatedCircuits(ctx),
    ...checkFuelPump(ctx, graph),
    ...checkCoilSupplies(ctx, graph),
    ...checkLampOutputs(ctx, graph),
    ...checkEcuPowerAndGrounds(ctx, graph),
    ...checkCanPairs(ctx, graph),
    ...checkCanStubs(ctx, graph),
    ...checkDiagnosticConnector(ctx, graph),
    ...checkCrankCamWiring(ctx, graph),
    ...checkEcuMainPower(ctx, graph),
    ...checkPedalTracks(ctx),
    ...(graph
      ? [
          ...powerPinsByWire(ctx, graph),
          ...unresolvedEnds(ctx, graph),
          ...cavitiesWithTwoWires(ctx, graph),
          ...spliceWiresProtected(ctx, graph),
        ]
      : []),
  ];
  // One finding per rule and subject: a rule read both from the pin map and from the wires says it once.
  const seen = new Set<string>();
  const findings = found.filter((f) => (seen.has(f.id) ? false : (seen.add(f.id), true)));
  // Severity first; sort is stable, so within a severity the rules keep the order they ran in.
  return findings.sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
}

/** Every finding, shown in the workshop's unit. */
export function runChecks(snapshot: ConversionSnapshot, options: CheckOptions): Finding[] {
  return storedFindings(snapshot, options).map((f) => showFinding(f, options.sizeUnit));
}

export function countFindings(findings: readonly Finding[]): CheckReport['counts'] {
  const counts: Record<Severity, number> = { error: 0, warning: 0, note: 0 };
  for (const f of findings) counts[f.severity] += 1;
  return counts;
}

/** A report of stored findings, shown in `unit`. */
export function reportOf(
  stored: readonly Finding[],
  unit: SizeUnit,
  now = new Date(),
): CheckReport {
  const findings = stored.map((f) => showFinding(f, unit));
  return { findings, counts: countFindings(findings), checkedAt: now.toISOString() };
}

export function checkReport(
  snapshot: ConversionSnapshot,
  options: CheckOptions,
  now = new Date(),
): CheckReport {
  return reportOf(storedFindings(snapshot, options), options.sizeUnit, now);
}

export type { CheckOptions };
