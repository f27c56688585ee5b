import { REVISION_STATUS_LABELS, type RevisionStatus } from '#shared/schemas/revisions.schema.ts';

const GLYPHS: Record<RevisionStatus, string> = {
  in_review: '◔',
  changes_requested: '↺',
  signed_off: '✓',
};
const TONES: Record<RevisionStatus, string> = {
  in_review: 'border-caution/50 bg-caution-wash text-caution',
  changes_requested: 'border-rule-strong bg-paper-sunk text-ink-soft',
  signed_off: 'border-sound/50 bg-sound-wash text-sound',
};

/** A revision's status as a word and a glyph (the tint only repeats what the word says). */
export function RevisionStatusBadge({ status }: { status: RevisionStatus }) {
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-sm font-medium ${TONES[status]}`}
    >
      <span aria-hidden>{GLYPHS[status]}</span>
      {REVISION_STATUS_LABELS[status]}
    </span>
  );
}
