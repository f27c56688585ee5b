/**
 * Every date and time the client shows, in the reader's own locale. Month names rather than
 * numbers, so 03/04 never has to be guessed at in a workshop that hires across borders.
 */
export type DateStyle =
  /** "2 Dec 2026" */
  | 'date'
  /** "2 Dec 2026, 11:46" */
  | 'dateTime'
  /** "2 Dec 2026, 11:46:23": when a few seconds tell two runs apart. */
  | 'dateTimeSeconds';

const OPTIONS: Record<DateStyle, Intl.DateTimeFormatOptions> = {
  date: { dateStyle: 'medium' },
  dateTime: { dateStyle: 'medium', timeStyle: 'short' },
  dateTimeSeconds: { dateStyle: 'medium', timeStyle: 'medium' },
};

// Made once per style and locale: long lists (the audit trail, the outbox) format many dates.
const formats = new Map<string, Intl.DateTimeFormat>();
function formatFor(style: DateStyle, locale: string | undefined) {
  const key = `${style} ${locale ?? ''}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, OPTIONS[style]);
    formats.set(key, format);
  }
  return format;
}

/** A date from the API (ISO text), a timestamp or a Date; "—" when there is none. */
export function formatDate(
  value: string | number | Date | null | undefined,
  style: DateStyle = 'dateTime',
  /** Tests pin one; the app uses the reader's. */
  locale?: string,
): string {
  if (value == null || value === '') return '—';
  const date = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(date.getTime())) return '—';
  return formatFor(style, locale).format(date);
}
