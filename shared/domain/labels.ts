import { remove as foldConfusables } from 'confusables';

/**
 * The key two labels (connectors, cavities, feeds) are compared by, so that labels a person cannot
 * tell apart on screen or on a printed worksheet cannot stand side by side: "Е1" with a Cyrillic Е
 * and "E1", fullwidth "ＥＣＵ" and "ECU", "E 1" and "E  1". Compatibility forms are folded (NFKC),
 * look-alike letters map to their Latin twins (the `confusables` package's table), and runs of
 * spaces count as one. Case is kept: "e1" and "E1" stay two labels, as before.
 * The table also folds accents ("Ö1" → "O1"): on a crimped label or a faded print those are as
 * easy to misread, so refusing them side by side errs on the safe side.
 */
export function labelKey(label: string): string {
  return foldConfusables(label.normalize('NFKC')).replace(/\s+/g, ' ').trim();
}

/** `labelKey` without case: for matching what a file says against what is stored. */
export function looseLabelKey(label: string): string {
  return labelKey(label).toUpperCase();
}
