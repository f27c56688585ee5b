import type { ReactNode } from 'react';
import type { Severity } from '#shared/schemas/checks.schema.ts';

/** Each severity as a glyph and a word: never told by colour alone. */
export const SEVERITY_INFO: Record<
  Severity,
  { glyph: string; word: string; plural: string; tone: string }
> = {
  error: { glyph: '✕', word: 'Error', plural: 'Errors', tone: 'text-fault' },
  warning: { glyph: '!', word: 'Warning', plural: 'Warnings', tone: 'text-caution' },
  note: { glyph: 'i', word: 'Note', plural: 'Notes', tone: 'text-ink-soft' },
};

/** A glyph in a small ring, as in Notice, in the colour of the words beside it. */
export function RingGlyph({ children }: { children: ReactNode }) {
  return (
    <span
      aria-hidden
      className="grid size-[1.125rem] shrink-0 place-items-center rounded-full border border-current text-[0.6875rem] leading-none font-bold"
    >
      {children}
    </span>
  );
}

/** "✕ Error", or "✕ 3 errors" with a count. */
export function SeverityLabel({
  severity,
  count,
  className = '',
}: {
  severity: Severity;
  count?: number;
  className?: string;
}) {
  const info = SEVERITY_INFO[severity];
  const text =
    count === undefined
      ? info.word
      : `${count} ${(count === 1 ? info.word : info.plural).toLowerCase()}`;
  return (
    <span
      className={`inline-flex items-center gap-1.5 font-semibold whitespace-nowrap ${info.tone} ${className}`}
    >
      <RingGlyph>{info.glyph}</RingGlyph>
      {text}
    </span>
  );
}

/** "✓ No findings": the all-clear, in the same glyph-and-word form. */
export function AllClearLabel({ children = 'No findings' }: { children?: string }) {
  return (
    <span className="inline-flex items-center gap-1.5 font-semibold whitespace-nowrap text-sound">
      <RingGlyph>✓</RingGlyph>
      {children}
    </span>
  );
}
