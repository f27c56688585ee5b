/**
 * Runs every rule over a snapshot of a conversion. Pure: the server calls it on the live plan and
 * on a revision's frozen snapshot alike, so a revision's findings can be recomputed and compared.
 */
import type { CheckReport, Finding, Severity } from '../../schemas/checks.schema.ts';
import type { ConversionSnapshot } from '../../schemas/snapshot.schema.ts';
import { CheckContext, type CheckOptions } from './check-context.ts';
import { checkFeed } from './feed-rules.ts';
import {
  checkJoinedPins,
  checkSensorGrounds,
  checkSharedDestinations,
  checkUndecided,
} from './pin-rules.ts';

const ORDER: Record<Severity, number> = { error: 0, warning: 1, note: 2 };

export function runChecks(snapshot: ConversionSnapshot, options: CheckOptions): Finding[] {
  const ctx = new CheckContext(snapshot, options);
  const findings = [
    ...checkUndecided(ctx),
    ...snapshot.feeds.flatMap((feed) => checkFeed(ctx, feed)),
    ...checkJoinedPins(ctx),
    ...checkSensorGrounds(ctx),
    ...checkSharedDestinations(ctx),
  ];
  // Severity first; sort is stable, so within a severity the rules keep the order they ran in.
  return findings.sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
}

export function countFindings(findings: readonly Finding[]): CheckReport['counts'] {
  const counts: Record<Severity, number> = { error: 0, warning: 0, note: 0 };
  for (const f of findings) counts[f.severity] += 1;
  return counts;
}

export function checkReport(
  snapshot: ConversionSnapshot,
  options: CheckOptions,
  now = new Date(),
): CheckReport {
  const findings = runChecks(snapshot, options);
  return { findings, counts: countFindings(findings), checkedAt: now.toISOString() };
}

export type { CheckOptions };
