import { z } from 'zod';

/** A database id in a URL: digits only, no leading zero. */
export const IdParam = z
  .string()
  .regex(/^[1-9][0-9]{0,15}$/, 'must be a positive whole number')
  .transform(Number);

export const IdParams = z.strictObject({ id: IdParam });

/** The one error shape every API error takes. */
export interface ApiErrorBody {
  error: {
    code: string;
    message: string;
    details?: unknown;
  };
}

export interface FieldIssue {
  field: string;
  message: string;
}

/*
 * What text may hold. Every string the API stores passes through these rules, so what one screen
 * shows is what another prints and what an export writes (issue #16):
 * - NFC normalisation: "é" typed as e + combining accent and "é" typed as one character are one
 *   string, compare equal and export the same.
 * - No control characters (C0, DEL, C1). Tab and line feed only in multi-line text (notes), where a
 *   carriage return is read as a line break.
 * - No lone surrogate halves: they are not text, and JSON and UTF-8 would turn them into U+FFFD.
 * - No zero-width or direction-control characters: "E1" followed by a zero-width space looks like
 *   "E1" and is not, and a right-to-left override makes "15 A" print as something else. Zero-width
 *   joiners (emoji sequences, Persian) are allowed in notes only.
 * - No U+FFFD: it is what a broken conversion leaves behind, never something a person meant.
 */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL = /[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/u;
// Tab and line feed: allowed in multi-line text only.
const LINE_BREAK_OR_TAB = /[\t\n]/u;
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const BIDI_CONTROL = /[\u061C\u200E\u200F\u202A-\u202E\u2066-\u2069]/u;
const INVISIBLE = /[\u00AD\u180E\u200B\u2060-\u2064\uFEFF]/u;
const JOINER = /[\u200C\u200D]/u;

const codePoint = (ch: string) =>
  `U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;

/** Why `text` cannot be stored, or null when it can. `multiline` allows tab, line feed and joiners. */
export function textProblem(text: string, multiline = false): string | null {
  const lone = LONE_SURROGATE.exec(text);
  if (lone) return `holds a broken character (a lone surrogate, ${codePoint(lone[0])})`;
  const control = CONTROL.exec(text);
  if (control) return `holds a control character (${codePoint(control[0])})`;
  if (!multiline && LINE_BREAK_OR_TAB.test(text)) return 'must be one line, without tabs';
  const bidi = BIDI_CONTROL.exec(text);
  if (bidi) return `holds an invisible text-direction character (${codePoint(bidi[0])})`;
  if (text.includes('\uFFFD')) {
    return 'holds the replacement character \uFFFD, a sign the text was damaged by an earlier conversion; retype it';
  }
  const invisible = INVISIBLE.exec(text) ?? (multiline ? null : JOINER.exec(text));
  if (invisible) return `holds an invisible zero-width character (${codePoint(invisible[0])})`;
  return null;
}

/** The stored form of text: NFC, with CR LF and lone CR read as LF in multi-line text. */
export function normalizeText(text: string, multiline = false): string {
  const nfc = LONE_SURROGATE.test(text) ? text : text.normalize('NFC');
  return multiline ? nfc.replace(/\r\n?/g, '\n') : nfc;
}

interface TextOptions {
  /** Notes and comments: tab and line breaks allowed. */
  multiline?: boolean;
}

const cleanText = (max: number, { multiline = false }: TextOptions = {}) =>
  z
    .string()
    .overwrite((s) => normalizeText(s, multiline))
    .trim()
    .max(max)
    .superRefine((s, ctx) => {
      const problem = textProblem(s, multiline);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    });

/** Trimmed, clean text with a length cap; empty strings are refused rather than stored. */
export const requiredText = (max: number, options?: TextOptions) =>
  cleanText(max, options).min(1, 'is required');
export const optionalText = (max: number, options?: TextOptions) => cleanText(max, options);
/** Multi-line text: notes, comments, descriptions. */
export const noteText = (max: number) => cleanText(max, { multiline: true });
export type IdParams = z.output<typeof IdParams>;
