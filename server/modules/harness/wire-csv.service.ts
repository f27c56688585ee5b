/**
 * The wire list as CSV: exported with both ends written by name ("E2-10", "S-03", "G-4", "R4:87",
 * "F4:out", "battery", "? by the tank"), and imported back with every problem named by row and
 * column and nothing written unless the whole file is sound.
 */
import { QueryTypes } from 'sequelize';
import { csvRecord } from '#shared/domain/csv.ts';
import { parseWireColour } from '#shared/domain/wire-colours.ts';
import { acceptedWireSize } from '#shared/domain/wire-sizes.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import {
  FUSE_TERMINALS,
  RELAY_TERMINALS,
  SOURCES,
  type Wire,
  type WireEnd,
} from '#shared/schemas/harness.schema.ts';
import { noteText, optionalText, requiredText } from '#shared/schemas/common.schema.ts';
import { WIRE_ZONES } from '#shared/schemas/feeds.schema.ts';
import { db } from '../../db/index.ts';
import { insertReturningId } from '../../db/portable.ts';
import type { Actor } from '../../lib/actor.ts';
import { badRequest } from '../../lib/errors.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { singleFileUpload } from '../../lib/upload.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { decodeUtf8, readCsv } from '../imports/csv-text.ts';
import { boxesOf, groundPointsOf, splicesOf, wiresOf } from './harness.repository.ts';
import { writeEnds } from './harness.service.ts';

export const WIRE_CSV_HEADERS = [
  'label',
  'colour',
  'size_mm2',
  'length_m',
  'zone',
  'end_a',
  'end_b',
  'notes',
  'twist_group',
  'shielded',
] as const;

/** Text cells are held to the same rules as the API's fields (shared/schemas/harness.schema.ts). */
const LABEL_TEXT = requiredText(20);
const TWIST_TEXT = optionalText(12);
const END_TEXT = optionalText(200);
const NOTE_TEXT = noteText(2000);

/** How the shielded column reads: yes/no, and the usual spellings of both. */
function readShielded(text: string): boolean | undefined {
  const t = text.trim().toLowerCase();
  if (['yes', 'y', 'true', '1', 'shielded'].includes(t)) return true;
  if (['', 'no', 'n', 'false', '0'].includes(t)) return false;
  return undefined;
}

/** A wire list is small: 2 MB is thousands of wires. */
export const uploadOne = singleFileUpload({ maxBytes: () => 2 * 1024 * 1024 });

interface Names {
  nameOf: (end: WireEnd) => string;
  read: (text: string) => WireEnd | string;
}

/** How ends are written and read for one conversion. */
async function namesFor(conversionId: number): Promise<Names> {
  const pins = await db().query<{ id: number; label: string; cavity: string }>(
    `SELECT p.id, c.label, p.cavity FROM pins p JOIN connectors c ON c.id = p.connector_id
      WHERE p.conversion_id = :conversionId`,
    { type: QueryTypes.SELECT, replacements: { conversionId } },
  );
  const [splices, grounds, boxes] = await Promise.all([
    splicesOf(conversionId),
    groundPointsOf(conversionId),
    boxesOf(conversionId),
  ]);
  const positions = boxes.flatMap((b) => b.positions);
  const pinName = new Map(pins.map((p) => [p.id, cavityName(p.label, p.cavity)]));
  const byName = new Map<string, WireEnd>();
  for (const p of pins)
    byName.set(cavityName(p.label, p.cavity).toUpperCase(), { kind: 'pin', refId: p.id });
  for (const s of splices) byName.set(s.label.toUpperCase(), { kind: 'splice', refId: s.id });
  for (const g of grounds) byName.set(g.label.toUpperCase(), { kind: 'ground', refId: g.id });
  for (const s of SOURCES) byName.set(s.toUpperCase(), { kind: 'source', source: s });
  return {
    nameOf(end) {
      switch (end.kind) {
        case 'pin':
          return pinName.get(end.refId) ?? `pin ${end.refId}`;
        case 'splice':
          return splices.find((s) => s.id === end.refId)?.label ?? '?';
        case 'ground':
          return grounds.find((g) => g.id === end.refId)?.label ?? '?';
        case 'relay':
        case 'fuse':
          return `${positions.find((p) => p.id === end.refId)?.label ?? '?'}:${end.terminal}`;
        case 'source':
          return end.source;
        case 'unresolved':
          return `? ${end.text}`.trim();
      }
    },
    read(text) {
      const t = text.trim();
      if (t === '' || t.startsWith('?'))
        return { kind: 'unresolved', text: t.replace(/^\?\s*/, '') };
      const terminal = /^(.+):(\w+)$/.exec(t);
      if (terminal) {
        const position = positions.find(
          (p) => p.label.toUpperCase() === terminal[1]!.toUpperCase(),
        );
        if (!position) return `no box position "${terminal[1]}" in this conversion`;
        const term = terminal[2]!.toLowerCase();
        if (position.kind === 'relay') {
          const ok = (RELAY_TERMINALS as readonly string[]).includes(term);
          return ok
            ? { kind: 'relay', refId: position.id, terminal: term as '30' }
            : `relay terminal "${terminal[2]}" is not one of ${RELAY_TERMINALS.join(', ')}`;
        }
        const ok = (FUSE_TERMINALS as readonly string[]).includes(term);
        return ok
          ? { kind: 'fuse', refId: position.id, terminal: term as 'in' }
          : `fuse terminal "${terminal[2]}" is not one of ${FUSE_TERMINALS.join(', ')}`;
      }
      return (
        byName.get(t.toUpperCase()) ??
        `"${t}" is no cavity, splice, ground point, box terminal or source of this conversion (write "? words" for an end still to be named)`
      );
    },
  };
}

export async function exportWires(
  actor: Actor,
  conversionId: number,
): Promise<{ fileName: string; text: string }> {
  const conversion = await findConversionInWorkshop(actor, conversionId);
  const names = await namesFor(conversionId);
  const lines = [csvRecord([...WIRE_CSV_HEADERS])];
  for (const w of await wiresOf(conversionId)) {
    lines.push(
      csvRecord([
        w.label,
        w.colour,
        w.sizeMm2,
        w.lengthM,
        w.zone,
        names.nameOf(w.ends[0]),
        names.nameOf(w.ends[1]),
        w.notes,
        w.twistGroup ?? '',
        w.shielded ? 'yes' : 'no',
      ]),
    );
  }
  const safe = conversion.name.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '') || 'conversion';
  return { fileName: `${safe}-wires.csv`, text: lines.join('') };
}

export interface WireImportResult {
  rows: number;
  imported: number;
  errors: Array<{ row: number; column: string; message: string }>;
}

/**
 * Reads a wire list. A row whose label names a wire of this conversion changes it; any other row
 * adds a wire. Any problem anywhere: 422 with every problem and nothing written.
 */
export async function importWires(
  actor: Actor,
  conversionId: number,
  bytes: Buffer | undefined,
  dryRun: boolean,
): Promise<WireImportResult> {
  await findConversionInWorkshop(actor, conversionId);
  if (!bytes) throw badRequest('No file: send it in the multipart field "file".');
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) {
    return { rows: 0, imported: 0, errors: [{ row: 1, column: '', message: decoded.message }] };
  }
  const table = readCsv(decoded.text.replace(/^\uFEFF/, ''));
  const errors: WireImportResult['errors'] = table.errors.map((e) => ({
    row: e.row ?? table.headerRow,
    column: e.column ?? '',
    message: e.message,
  }));
  const col = (name: string) => table.headers.findIndex((h) => h.trim().toLowerCase() === name);
  for (const required of ['end_a', 'end_b'] as const) {
    if (col(required) < 0) {
      errors.push({
        row: table.headerRow,
        column: required,
        message: `the column "${required}" is missing`,
      });
    }
  }
  const names = await namesFor(conversionId);
  const rows: Array<
    Omit<Wire, 'id' | 'conversionId' | 'version' | 'label'> & { label: string | null }
  > = [];
  // A column the file leaves out leaves that field of an existing wire alone.
  const kept = <T>(column: string, read: T, existing: T | undefined): T =>
    col(column) >= 0 || existing === undefined ? read : existing;
  const labels = new Set<string>();
  for (const record of table.records) {
    const cell = (name: string) => {
      const i = col(name);
      return i < 0 ? '' : (record.cells[i] ?? '').trim();
    };
    const problem = (column: string, message: string) =>
      errors.push({ row: record.row, column, message });
    /** A text cell as the API would take it (NFC, no control or invisible characters). */
    const text = (column: string, schema: typeof LABEL_TEXT, value = cell(column)) => {
      const parsed = schema.safeParse(value);
      if (parsed.success) return parsed.data;
      problem(column, parsed.error.issues[0]?.message ?? 'is not text Loomwright can keep');
      return value;
    };
    const label = cell('label') ? text('label', LABEL_TEXT) : null;
    if (label) {
      if (labels.has(label.toUpperCase())) problem('label', `"${label}" is used by two rows`);
      labels.add(label.toUpperCase());
    }
    let colour = '';
    if (cell('colour')) {
      const parsed = parseWireColour(cell('colour'));
      if (parsed.ok) colour = parsed.value;
      else problem('colour', parsed.error);
    }
    let sizeMm2: number | null = null;
    if (cell('size_mm2')) {
      const size = acceptedWireSize(Number(cell('size_mm2').replace(',', '.')));
      if (size === null)
        problem(
          'size_mm2',
          `"${cell('size_mm2')}" is not an ISO 6722 size or the area of an AWG size`,
        );
      else sizeMm2 = size;
    }
    let lengthM: number | null = null;
    if (cell('length_m')) {
      const n = Number(cell('length_m').replace(',', '.'));
      if (!(n >= 0 && n <= 100))
        problem('length_m', `"${cell('length_m')}" is not a length from 0 to 100 m`);
      else lengthM = n;
    }
    const zone = (cell('zone') || 'cabin') as Wire['zone'];
    if (!(WIRE_ZONES as readonly string[]).includes(zone)) {
      problem('zone', `"${zone}" is not a zone: use ${WIRE_ZONES.join(' or ')}`);
    }
    const twistGroup = text('twist_group', TWIST_TEXT);
    const shielded = readShielded(cell('shielded'));
    if (shielded === undefined) problem('shielded', `"${cell('shielded')}" is not yes or no`);
    const ends: WireEnd[] = [];
    for (const column of ['end_a', 'end_b'] as const) {
      const read = names.read(cell(column));
      if (typeof read === 'string') problem(column, read);
      else if (read.kind === 'unresolved')
        ends.push({ kind: 'unresolved', text: text(column, END_TEXT, read.text) });
      else ends.push(read);
    }
    rows.push({
      label,
      colour,
      sizeMm2,
      insulationRatingC: null,
      lengthM,
      zone,
      branch: '',
      notes: text('notes', NOTE_TEXT),
      twistGroup,
      shielded: shielded ?? false,
      ends: [
        ends[0] ?? { kind: 'unresolved', text: '' },
        ends[1] ?? { kind: 'unresolved', text: '' },
      ],
    });
  }
  const result = { rows: rows.length, imported: 0, errors };
  if (errors.length || dryRun) return result;

  await inTransaction(db(), async (t) => {
    const existing = await wiresOf(conversionId, t);
    const byLabel = new Map(existing.map((w) => [w.label.toUpperCase(), w]));
    let next = existing.reduce(
      (max, w) => Math.max(max, Number(/^W-(\d+)$/.exec(w.label)?.[1] ?? 0)),
      0,
    );
    const now = new Date().toISOString();
    for (const row of rows) {
      const label = row.label ?? `W-${String(++next).padStart(3, '0')}`;
      const same = byLabel.get(label.toUpperCase());
      const values = {
        conversionId,
        label,
        colour: kept('colour', row.colour, same?.colour),
        size: kept('size_mm2', row.sizeMm2, same?.sizeMm2),
        length: kept('length_m', row.lengthM, same?.lengthM),
        zone: kept('zone', row.zone, same?.zone),
        notes: kept('notes', row.notes, same?.notes),
        twistGroup: kept('twist_group', row.twistGroup ?? '', same?.twistGroup),
        shielded: kept('shielded', row.shielded ?? false, same?.shielded),
        now,
      };
      let wireId: number;
      if (same) {
        await db().query(
          `UPDATE wires SET colour = :colour, size_mm2 = :size, length_m = :length, zone = :zone,
             notes = :notes, twist_group = :twistGroup, shielded = :shielded,
             version = version + 1, updated_at = :now WHERE id = :id`,
          { replacements: { ...values, id: same.id }, transaction: t },
        );
        wireId = same.id;
      } else {
        wireId = await insertReturningId(
          db(),
          `INSERT INTO wires (conversion_id, label, colour, size_mm2, length_m, zone, branch, notes,
             twist_group, shielded, version, created_at, updated_at)
           VALUES (:conversionId, :label, :colour, :size, :length, :zone, '', :notes, :twistGroup,
             :shielded, 0, :now, :now)`,
          { replacements: values, transaction: t },
        );
      }
      await writeEnds(wireId, row.ends, t);
    }
    await recordAudit(t, actor, {
      conversionId,
      action: 'import',
      entityType: 'wire',
      summary: `Imported ${rows.length} wires from CSV`,
    });
  });
  return { ...result, imported: rows.length };
}
