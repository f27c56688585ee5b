import type { UpdateWireRequest, Wire, WireEnd } from '#shared/schemas/harness.schema.ts';
import { endText, type EndOption } from './end-options.ts';
import { WIRE_COLUMNS, cellChange, withEnd } from './wire-cells.ts';

export type WirePatch = Omit<UpdateWireRequest, 'version'>;

/**
 * An end from pasted or copied text: a place's short name ("R4 relay · 87", "E2-10"), the text the
 * grid shows for it, or "Not yet fastened: …". Null when nothing of the conversion has that name.
 */
export function endFromText(text: string, options: readonly EndOption[]): WireEnd | null {
  const t = text.trim().toLowerCase();
  if (!t) return null;
  const loose = /^not yet fastened:\s*(.*)$/i.exec(text.trim());
  if (loose) return { kind: 'unresolved', text: loose[1] ?? '' };
  const byKey = new Map(options.map((o) => [o.key, o]));
  const hit = options.find(
    (o) => o.label.toLowerCase() === t || endText(o.end, byKey).toLowerCase() === t,
  );
  return hit?.end ?? null;
}

/**
 * What pasting a block of text (tab-separated columns, one line a row) from the cursor down and
 * right changes: one patch per wire, so a row's cells save together under one version.
 */
export function pastePatches(
  rows: readonly Wire[],
  at: { row: number; col: number },
  text: string,
  options: readonly EndOption[],
): { patches: Array<{ wire: Wire; patch: WirePatch }>; problems: string[] } {
  const lines = text.replace(/\r/g, '').split('\n');
  if (lines.length > 1 && lines.at(-1) === '') lines.pop();
  const patches: Array<{ wire: Wire; patch: WirePatch }> = [];
  const problems: string[] = [];
  lines.forEach((line, i) => {
    const wire = rows[at.row + i];
    if (!wire) return;
    let ends = wire.ends;
    let patch: WirePatch = {};
    line.split('\t').forEach((cell, j) => {
      const col = WIRE_COLUMNS[at.col + j];
      if (!col) return;
      if (col === 'endA' || col === 'endB') {
        const end = endFromText(cell, options);
        if (end) ends = withEnd({ ...wire, ends }, col, end);
        else problems.push(`${wire.label}: no place named "${cell.trim()}"`);
        return;
      }
      const change = cellChange(col, cell);
      if (change.ok) patch = { ...patch, ...change.patch };
      else problems.push(`${wire.label}: ${change.message}`);
    });
    if (ends !== wire.ends) patch = { ...patch, ends };
    if (Object.keys(patch).length) patches.push({ wire, patch });
  });
  return { patches, problems };
}

/** The patch that puts back what a patch changed on the wire as it was. */
export function inversePatch(wire: Wire, patch: WirePatch): WirePatch {
  const back: WirePatch = {};
  if (patch.label !== undefined) back.label = wire.label;
  if (patch.colour !== undefined) back.colour = wire.colour;
  if (patch.sizeMm2 !== undefined) back.sizeMm2 = wire.sizeMm2;
  if (patch.lengthM !== undefined) back.lengthM = wire.lengthM;
  if (patch.zone !== undefined) back.zone = wire.zone;
  if (patch.notes !== undefined) back.notes = wire.notes;
  if (patch.twistGroup !== undefined) back.twistGroup = wire.twistGroup ?? '';
  if (patch.shielded !== undefined) back.shielded = wire.shielded ?? false;
  if (patch.branch !== undefined) back.branch = wire.branch;
  if (patch.insulationRatingC !== undefined) back.insulationRatingC = wire.insulationRatingC;
  if (patch.ends !== undefined) back.ends = wire.ends;
  return back;
}
