import { describe, expect, it } from 'vitest';
import { formatDate } from '../../../src/lib/format-date.ts';

// The texts are CLDR's medium date and time patterns for en-GB and en-US (from memory), as Node's
// ICU gives them. The hour depends on the machine's time zone, so only its shape is checked.
describe('formatDate', () => {
  const at = '2026-12-02T09:05:07Z';

  it('spells the month, so the order of day and month never has to be guessed', () => {
    expect(formatDate('2026-03-04T12:00:00Z', 'date', 'en-GB')).toBe('4 Mar 2026');
    expect(formatDate('2026-03-04T12:00:00Z', 'date', 'en-US')).toBe('Mar 4, 2026');
  });

  it('adds the time, with seconds only when asked', () => {
    const minutes = formatDate(at, 'dateTime', 'en-GB');
    const seconds = formatDate(at, 'dateTimeSeconds', 'en-GB');
    expect(minutes).toMatch(/^\d{1,2} Dec 2026, \d{2}:\d{2}$/);
    expect(seconds).toMatch(/^\d{1,2} Dec 2026, \d{2}:\d{2}:07$/);
  });

  it('takes a Date or a timestamp as well as API text, and shows a dash for none', () => {
    const noon = Date.UTC(2026, 2, 4, 12);
    expect(formatDate(noon, 'date', 'en-GB')).toBe('4 Mar 2026');
    expect(formatDate(new Date(noon), 'date', 'en-GB')).toBe('4 Mar 2026');
    expect(formatDate(null)).toBe('—');
    expect(formatDate(undefined)).toBe('—');
    expect(formatDate('not a date')).toBe('—');
  });
});
