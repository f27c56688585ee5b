import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../shared/schemas/checks.schema.ts';
import {
  countsSentence,
  formatFindingValue,
  hasUnfusedFinding,
  sortFindings,
  subjectLinks,
} from '../../../src/features/checks/lib/findings.ts';

const finding = (id: string, severity: Finding['severity'], rule = 'voltage_drop') =>
  ({ id, severity, rule, subject: {} }) as Finding;

describe('findings on screen', () => {
  it('lists errors, then warnings, then notes, keeping the server’s order within each', () => {
    const sorted = sortFindings([
      finding('n', 'note'),
      finding('w1', 'warning'),
      finding('e1', 'error'),
      finding('w2', 'warning'),
      finding('e2', 'error'),
    ]);
    expect(sorted.map((f) => f.id)).toEqual(['e1', 'e2', 'w1', 'w2', 'n']);
  });

  it('links each pin and the feed, named when the names are known', () => {
    const names = {
      pin: (id: number) => ({ 193: 'E3-13' })[id],
      feed: (id: number) => ({ 9: 'Cooling fan' })[id],
    };
    expect(subjectLinks({ subject: { pinIds: [193, 194] } }, names)).toEqual([
      { kind: 'pin', id: 193, label: 'Pin E3-13' },
      { kind: 'pin', id: 194, label: 'Pin #194' },
    ]);
    expect(subjectLinks({ subject: { feedId: 9 } }, names)).toEqual([
      { kind: 'feed', id: 9, label: 'Feed “Cooling fan”' },
    ]);
  });

  it('writes a number with its unit, a missing one as a dash', () => {
    expect(formatFindingValue({ label: 'Fuse', value: 30, unit: 'A' })).toBe('30 A');
    expect(formatFindingValue({ label: 'Derating factor', value: 0.85 })).toBe('0.85');
    expect(formatFindingValue({ label: 'Fuse', value: null, unit: 'A' })).toBe('—');
    expect(formatFindingValue({ label: 'Row', value: '18 AWG' })).toBe('18 AWG');
    expect(formatFindingValue({ label: 'Fitted', value: true })).toBe('yes');
  });

  it('counts in words', () => {
    expect(countsSentence({ error: 4, warning: 1, note: 0 })).toBe('4 errors, 1 warning, no notes');
  });

  it('spots an unfused feed or power pin', () => {
    expect(hasUnfusedFinding([finding('a', 'error', 'unfused_feed')])).toBe(true);
    expect(hasUnfusedFinding([finding('a', 'error', 'power_pin_unfused')])).toBe(true);
    expect(hasUnfusedFinding([finding('a', 'error')])).toBe(false);
  });
});
