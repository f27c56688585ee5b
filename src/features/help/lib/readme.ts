/**
 * Reading the README for the Help page, so the tour and the table of rules are written once: the
 * Help page shows what the README says, never a second copy that drifts from it.
 */

/** The text under a "## " heading, up to the next one. */
export function section(markdown: string, heading: string): string {
  const lines = markdown.split(/\r?\n/);
  const start = lines.findIndex((l) => l.trim() === `## ${heading}`);
  if (start < 0) return '';
  const rest = lines.slice(start + 1);
  const end = rest.findIndex((l) => /^## /.test(l));
  return (end < 0 ? rest : rest.slice(0, end)).join('\n').trim();
}

export interface Table {
  head: string[];
  rows: string[][];
}

const cells = (line: string) =>
  line
    .trim()
    .replace(/^\|/, '')
    .replace(/\|$/, '')
    .split('|')
    .map((c) => c.trim());

/** The first pipe table in a piece of markdown (the row of dashes under its heading dropped). */
export function firstTable(markdown: string): Table | null {
  const lines = markdown.split(/\r?\n/);
  const start = lines.findIndex((l) => l.trim().startsWith('|'));
  if (start < 0) return null;
  const block: string[] = [];
  for (const line of lines.slice(start)) {
    if (!line.trim().startsWith('|')) break;
    block.push(line);
  }
  const [head, , ...rows] = block;
  return head ? { head: cells(head), rows: rows.map(cells) } : null;
}

/** The items of the first numbered list, each with its continuation lines joined. */
export function numberedItems(markdown: string): string[] {
  const items: string[] = [];
  let current: string | null = null;
  for (const line of markdown.split(/\r?\n/)) {
    const item = /^\d+\.\s+(.*)$/.exec(line);
    if (item) {
      if (current !== null) items.push(current);
      current = item[1]!;
    } else if (current !== null && /^\s+\S/.test(line)) {
      current += ` ${line.trim()}`;
    } else if (current !== null && line.trim() === '') {
      items.push(current);
      current = null;
    }
  }
  if (current !== null) items.push(current);
  return items;
}

/** The paragraphs of a piece of markdown outside its tables and lists. */
export function paragraphs(markdown: string): string[] {
  return markdown
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter((p) => p && !p.startsWith('|') && !/^\d+\.\s/.test(p) && !p.startsWith('```'))
    .map((p) => p.replace(/\s*\n\s*/g, ' '));
}

export type Inline =
  | { kind: 'text'; text: string }
  | { kind: 'strong'; text: string }
  | { kind: 'code'; text: string }
  | { kind: 'link'; text: string; href: string };

/** Bold, inline code and links; everything else is text. */
export function inline(text: string): Inline[] {
  const out: Inline[] = [];
  const pattern = /\*\*(.+?)\*\*|`([^`]+)`|\[([^\]]+)\]\(([^)]+)\)/g;
  let at = 0;
  for (const m of text.matchAll(pattern)) {
    if (m.index > at) out.push({ kind: 'text', text: text.slice(at, m.index) });
    if (m[1] !== undefined) out.push({ kind: 'strong', text: m[1] });
    else if (m[2] !== undefined) out.push({ kind: 'code', text: m[2] });
    else out.push({ kind: 'link', text: m[3]!, href: m[4]! });
    at = m.index + m[0].length;
  }
  if (at < text.length) out.push({ kind: 'text', text: text.slice(at) });
  return out;
}
