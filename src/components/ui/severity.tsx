import type { Severity } from '#shared/schemas/checks.schema.ts';

/** Each severity as a glyph and a word: never told by colour alone. */
export const SEVERITY_INFO: Record<
  Severity,
  { glyph: string; word: string; plural: string; tone: string; rank: number }
> = {
  error: { glyph: '✕', word: 'Error', plural: 'Errors', tone: 'text-fault', rank: 0 },
  warning: { glyph: '!', word: 'Warning', plural: 'Warnings', tone: 'text-caution', rank: 1 },
  note: { glyph: 'i', word: 'Note', plural: 'Notes', tone: 'text-ink-soft', rank: 2 },
};

/** The glyph in a small ring, as in Notice. */
export function SeverityGlyph({ severity }: { severity: Severity }) {
  const info = SEVERITY_INFO[severity];
  return (
    <span
      aria-hidden
      className={`grid size-[1.125rem] shrink-0 place-items-center rounded-full border border-current text-[0.6875rem] leading-none font-bold ${info.tone}`}
    >
      {info.glyph}
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
      <SeverityGlyph severity={severity} />
      {text}
    </span>
  );
}

/** "✓ No findings": the all-clear, in the same glyph-and-word form. */
export function AllClearLabel({ children = 'No findings' }: { children?: string }) {
  return (
    <span className="inline-flex items-center gap-1.5 font-semibold whitespace-nowrap text-sound">
      <span
        aria-hidden
        className="grid size-[1.125rem] shrink-0 place-items-center rounded-full border border-current text-[0.6875rem] leading-none font-bold"
      >
        ✓
      </span>
      {children}
    </span>
  );
}
