/** How findings read on screen: their order, their links, their numbers. Pure, unit-tested. */
import {
  SEVERITIES,
  type Finding,
  type FindingValue,
  type Severity,
} from '#shared/schemas/checks.schema.ts';

/** SEVERITIES lists the worst first. */
const rank = (severity: Severity) => SEVERITIES.indexOf(severity);

/** Errors first, then warnings, then notes; the server's order within each. */
export function sortFindings(findings: readonly Finding[]): Finding[] {
  return findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => rank(a.f.severity) - rank(b.f.severity) || a.i - b.i)
    .map(({ f }) => f);
}

export interface SubjectLink {
  kind: 'pin' | 'feed';
  id: number;
  label: string;
}

/** What a finding is about, named for its links: "Pin E3-13", "Feed “Cooling fan”". */
export function subjectLinks(
  finding: Pick<Finding, 'subject'>,
  names: { pin: (id: number) => string | undefined; feed: (id: number) => string | undefined },
): SubjectLink[] {
  const links: SubjectLink[] = [];
  for (const id of finding.subject.pinIds ?? []) {
    links.push({ kind: 'pin', id, label: `Pin ${names.pin(id) ?? `#${id}`}` });
  }
  const feedId = finding.subject.feedId;
  if (feedId != null) {
    const name = names.feed(feedId);
    links.push({ kind: 'feed', id: feedId, label: name ? `Feed “${name}”` : `Feed #${feedId}` });
  }
  return links;
}

/** A finding's number with its unit: "30 A", "11.15 %", "0.85", "yes", "—". */
export function formatFindingValue(v: FindingValue): string {
  if (v.value === null || v.value === '') return '—';
  if (typeof v.value === 'boolean') return v.value ? 'yes' : 'no';
  const text = typeof v.value === 'number' ? String(v.value) : v.value;
  return v.unit ? `${text} ${v.unit}` : text;
}

/** Rules whose findings mean a feed or power pin has no fuse: a fire risk. */
const UNFUSED_RULES = new Set(['unfused_feed', 'power_pin_unfused']);

export function hasUnfusedFinding(findings: readonly Finding[]): boolean {
  return findings.some((f) => UNFUSED_RULES.has(f.rule));
}

/** "4 errors, 2 warnings, no notes" for a status line and screen readers. */
export function countsSentence(counts: Record<Severity, number>): string {
  const part = (n: number, one: string, many: string) =>
    n === 0 ? `no ${many}` : `${n} ${n === 1 ? one : many}`;
  return [
    part(counts.error, 'error', 'errors'),
    part(counts.warning, 'warning', 'warnings'),
    part(counts.note, 'note', 'notes'),
  ].join(', ');
}
