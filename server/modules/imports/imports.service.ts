import { createHash } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import {
  describeGrowth,
  MAX_IMPORT_ERRORS_LISTED,
  MAX_IMPORT_ROWS,
  PREVIEW_PAGE_ROWS,
  type ColumnTarget,
  type ConnectorGrowth,
  type ImportField,
  type ImportIssue,
  type ImportResult,
} from '#shared/schemas/imports.schema.ts';
import { PIN_FIELD_NAMES } from '#shared/schemas/pin-map.schema.ts';
import type { SizeUnit } from '#shared/schemas/workshop.schema.ts';
import { runBulkWrites, sqlLiteral } from '../../db/bulk-write.ts';
import { readRows, storedTime } from '../../db/fast-read.ts';
import { db } from '../../db/index.ts';
import { Connector, Feed, FeedLoad, ImportMapping, Pin, PinImport } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { AppError, notFound } from '../../lib/errors.ts';
import { logger } from '../../lib/logger.ts';
import { inTransaction } from '../../lib/transaction.ts';
import { displayFileName, type UploadedFile } from '../../lib/upload.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { loadsFollowConnectorPins } from '../feeds/feed-links.service.ts';
import { decodeUtf8, DELIMITER_NAMES, readCsv } from './csv-text.ts';
import { headerSignature, parseMappingField, resolveMapping } from './mapping.ts';
import {
  planImport,
  planImportYielding,
  type ConnectorPlan,
  type Plan,
  type PlanContext,
  type PinData,
} from './plan.ts';
import { PreparedImports } from './prepared-imports.ts';
import { parseRowsYielding, type PinRow } from './rows.ts';

export type ImportTarget =
  { kind: 'connector'; connectorId: number } | { kind: 'conversion'; conversionId: number };

/** Rows written per statement: short statements keep the write lock short (SQLite section). */
const CHUNK = 500;

function chunks<T>(items: readonly T[], size = CHUNK): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

interface Where {
  conversionId: number;
  connectorId: number | null;
  label: string | null;
  /** The workshop's size unit, in which the plan shows sizes. */
  sizeUnit: SizeUnit;
}

/** Where an import goes, as one read finds it (`locate`). */
interface Located {
  conversionId: number;
  connectorId: number | null;
  label: string | null;
  sizeUnit: SizeUnit;
  counter: number;
}

/**
 * The place an import goes, in the actor's workshop (else 404), with the workshop's size unit and
 * the conversion's change counter (migration 0009), in one read: the counter is read before the
 * pin map, so if it has not moved by the time the transaction starts, the plan worked out now is
 * still the plan.
 */
async function locate(
  actor: Actor,
  target: ImportTarget,
): Promise<{ where: Where; counter: number }> {
  const counted = `COALESCE(cc.counter, 0) AS counter, w.size_unit AS "sizeUnit"
       FROM conversions c
       JOIN workshops w ON w.id = c.workshop_id
       LEFT JOIN conversion_changes cc ON cc.conversion_id = c.id`;
  const [row] =
    target.kind === 'conversion'
      ? await readRows<Located>(
          `SELECT c.id AS "conversionId", NULL AS "connectorId", NULL AS label, ${counted}
            WHERE c.id = ? AND c.workshop_id = ?`,
          [target.conversionId, actor.workshopId],
        )
      : await readRows<Located>(
          `SELECT c.id AS "conversionId", k.id AS "connectorId", k.label, ${counted}
             JOIN connectors k ON k.conversion_id = c.id
            WHERE k.id = ? AND c.workshop_id = ?`,
          [target.connectorId, actor.workshopId],
        );
  if (!row) throw notFound(target.kind === 'conversion' ? 'That conversion' : 'That connector');
  const { counter, ...where } = row;
  return { where, counter: Number(counter) };
}

const PIN_ATTRIBUTES = ['id', 'connectorId', 'cavity', 'position', ...PIN_FIELD_NAMES, 'version'];

/** A snapshot of the conversion's connectors, pins and feeds: what the plan works on. */
async function loadContext(where: Where, transaction?: Transaction): Promise<PlanContext> {
  const { conversionId } = where;
  const connectors = await Connector.findAll({
    where: { conversionId },
    attributes: ['id', 'label', 'side', 'cavityCount', 'rows', 'columns'],
    order: [['id', 'ASC']],
    raw: true,
    transaction,
  });
  const pins = (await Pin.findAll({
    where: { conversionId },
    attributes: PIN_ATTRIBUTES,
    raw: true,
    transaction,
  })) as unknown as PinData[];
  const feeds = await Feed.findAll({
    where: { conversionId },
    attributes: ['id', 'name', 'relayCoilPinId'],
    raw: true,
    transaction,
  });
  const loads = feeds.length
    ? await FeedLoad.findAll({
        where: { feedId: feeds.map((f) => f.id) },
        attributes: ['pinId'],
        raw: true,
        transaction,
      })
    : [];
  const referencedPinIds = new Set<number>();
  for (const p of pins) if (p.destinationPinId != null) referencedPinIds.add(p.destinationPinId);
  for (const f of feeds) if (f.relayCoilPinId != null) referencedPinIds.add(f.relayCoilPinId);
  for (const l of loads) if (l.pinId != null) referencedPinIds.add(l.pinId);
  return {
    connectors,
    pins,
    feeds: feeds.map((f) => ({ id: f.id, name: f.name })),
    referencedPinIds,
    sizeUnit: where.sizeUnit,
    target:
      where.connectorId === null
        ? { kind: 'conversion' }
        : { kind: 'connector', connectorId: where.connectorId },
  };
}

interface Checked {
  sha256: string;
  fileName: string;
  errors: ImportIssue[];
  notes: string[];
  rows: PinRow[];
  mentioned: Array<{ connector: string | null; cavity: string }>;
  mapping: ImportResult['mapping'];
  mappingSource: ImportResult['mappingSource'];
  headers: string[];
  signature: string | null;
  headerOf: (field: ImportField) => string | null;
  imported: Set<ImportField>;
  table: Array<{ row: number; cells: string[] }>;
  dataRows: number;
  /** The workshop's saved column choices this check used (`targetsJson`), if any. */
  savedTargets: string | null;
}

/** Everything that needs no database write: decoding, parsing, the mapping, every cell. */
async function checkFile(
  actor: Actor,
  where: Where,
  file: UploadedFile,
  sha256: string,
  given: Map<string, ColumnTarget> | null,
): Promise<Checked> {
  const checked: Checked = {
    sha256,
    fileName: displayFileName(file.originalName),
    errors: [],
    notes: [],
    rows: [],
    mentioned: [],
    mapping: [],
    mappingSource: 'detected',
    headers: [],
    signature: null,
    headerOf: () => null,
    imported: new Set(),
    table: [],
    dataRows: 0,
    savedTargets: null,
  };
  const decoded = decodeUtf8(file.buffer);
  if (!decoded.ok) {
    checked.errors.push({ row: null, column: null, message: decoded.message });
    return checked;
  }
  if (decoded.hadBom)
    checked.notes.push('The byte-order mark at the start of the file was removed.');
  const csv = readCsv(decoded.text, MAX_IMPORT_ROWS);
  if (csv.overLimit) {
    throw new AppError(
      413,
      'too_many_rows',
      `The file has more than ${MAX_IMPORT_ROWS.toLocaleString('en')} pin rows, the most one import takes. Nothing was imported; split the file, for example one file per connector.`,
      { maxRows: MAX_IMPORT_ROWS },
    );
  }
  checked.headers = csv.headers;
  checked.dataRows = csv.records.length;
  checked.table = csv.records.map((r) => ({ row: r.row, cells: r.cells }));
  if (csv.headers.length === 0) {
    checked.errors.push({
      row: null,
      column: null,
      message: 'The file is empty: it has no header line.',
    });
    return checked;
  }
  if (csv.delimiter !== ',')
    checked.notes.push(`Columns are separated by ${DELIMITER_NAMES[csv.delimiter]}s.`);
  if (csv.blankLines) {
    checked.notes.push(
      `${csv.blankLines} blank line${csv.blankLines === 1 ? ' was' : 's were'} skipped.`,
    );
  }

  checked.signature = headerSignature(csv.headers);
  const saved = given
    ? null
    : await ImportMapping.findOne({
        where: { workshopId: actor.workshopId, headerSignature: checked.signature },
      });
  checked.savedTargets = saved?.targetsJson ?? null;
  const resolved = resolveMapping(
    csv.headers,
    csv.headerRow,
    given,
    saved ? (JSON.parse(saved.targetsJson) as ColumnTarget[]) : null,
  );
  checked.mapping = resolved.mapping;
  checked.mappingSource = resolved.source;
  checked.notes.push(...resolved.notes);
  if (resolved.source === 'saved') {
    checked.notes.push(
      'The column choices from your workshop’s last import of a file with these columns were used.',
    );
  }
  checked.headerOf = (field) => {
    const i = resolved.columnOf.get(field);
    return i === undefined ? null : csv.headers[i]!;
  };
  checked.imported = new Set(resolved.columnOf.keys());
  checked.errors.push(...csv.errors, ...resolved.errors);
  const lacksConnector = where.connectorId === null && !resolved.columnOf.has('connector');
  if (lacksConnector) {
    checked.errors.push({
      row: csv.headerRow,
      column: null,
      message:
        'To import into the whole conversion the file needs a connector column saying which connector each row is on.',
    });
  }
  if (csv.errors.length || !resolved.columnOf.has('cavity') || lacksConnector) return checked;

  const parsed = await parseRowsYielding(csv.records, csv.headers, resolved.columnOf);
  checked.rows = parsed.rows;
  checked.mentioned = parsed.mentioned;
  checked.errors.push(...parsed.errors);
  if (csv.records.length === 0) {
    checked.errors.push({
      row: null,
      column: null,
      message: 'The file has a header but no pin rows.',
    });
  }
  return checked;
}

function byRow(a: ImportIssue, b: ImportIssue): number {
  return (a.row ?? 0) - (b.row ?? 0);
}

function growthOf(plan: Plan | null): ConnectorGrowth[] {
  return (plan?.connectors ?? []).flatMap((c) =>
    c.grows ? [{ connector: c.label, cavityCount: c.grows.from, cavities: c.grows.cavities }] : [],
  );
}

/** Applying a file that grows a connector needs the person's say-so from the preview. */
function assertGrowthConfirmed(plan: Plan, allowGrowth: boolean) {
  const growth = growthOf(plan);
  if (!growth.length || allowGrowth) return;
  throw new AppError(
    409,
    'confirm_growth',
    `${growth.map(describeGrowth).join('; ')}. Nothing was imported: confirm the new cavities in the preview, or correct the cavity numbers.`,
    { growth },
  );
}

function buildResult(
  where: Where,
  checked: Checked,
  plan: Plan | null,
  dryRun: boolean,
  previous: ImportResult['previousImport'],
  pageNumber = 1,
): ImportResult {
  const errors = [...checked.errors, ...(plan?.errors ?? [])].sort(byRow);
  const result: ImportResult = {
    dryRun,
    rows: checked.dataRows,
    imported: 0,
    errors: errors.slice(0, MAX_IMPORT_ERRORS_LISTED),
    errorCount: errors.length,
    changes: plan?.changes ?? [],
    summary: plan?.summary ?? { added: 0, changed: 0, unchanged: 0, removed: 0 },
    growth: growthOf(plan),
    planned: plan !== null,
    notes: checked.notes,
    mapping: checked.mapping,
    mappingSource: checked.mappingSource,
    sha256: checked.sha256,
    previousImport: previous,
    target: {
      conversionId: where.conversionId,
      connectorId: where.connectorId,
      label: where.label,
    },
  };
  return dryRun ? onePage(result, checked, errors, pageNumber) : result;
}

/**
 * A preview cut to one page of the file's lines: a 20,000-line file previewed whole was megabytes
 * of JSON that the browser then had to lay out. The counts and the summary stay whole.
 */
function onePage(
  result: ImportResult,
  checked: Checked,
  errors: ImportIssue[],
  pageNumber: number,
): ImportResult {
  const size = PREVIEW_PAGE_ROWS;
  const count = Math.max(1, Math.ceil(checked.table.length / size));
  const number = Math.min(pageNumber, count);
  const table = checked.table.slice((number - 1) * size, number * size);
  const pageOf = new Map(checked.table.map((r, i) => [r.row, Math.floor(i / size) + 1]));
  const onThisPage = (row: number | null) => row !== null && pageOf.get(row) === number;
  // Problems of no line of the table (the file, its header) are shown on every page.
  const pageErrors = errors.filter(
    (e) => e.row === null || !pageOf.has(e.row) || onThisPage(e.row),
  );
  const withProblems = [
    ...new Set(errors.map((e) => (e.row === null ? undefined : pageOf.get(e.row)))),
  ]
    .filter((p): p is number => p !== undefined)
    .sort((a, b) => a - b)
    .slice(0, 100);
  return {
    ...result,
    errors: pageErrors.slice(0, MAX_IMPORT_ERRORS_LISTED),
    changes: result.changes.filter((c) => c.kind === 'remove' || onThisPage(c.row)),
    table,
    page: { number, count, size, withProblems },
  };
}

function refused(result: ImportResult): AppError {
  const n = result.errorCount;
  const { table: _table, page: _page, ...details } = result;
  return new AppError(
    422,
    'import_refused',
    `The file has ${n} problem${n === 1 ? '' : 's'}; nothing was imported. Fix ${n === 1 ? 'it' : 'them'} and upload the file again.`,
    details,
  );
}

async function previousImport(
  where: Where,
  sha256: string,
): Promise<ImportResult['previousImport']> {
  const [earlier] = await readRows<{ at: unknown; importedBy: string | null }>(
    `SELECT i.created_at AS at, u.name AS "importedBy"
       FROM pin_imports i LEFT JOIN users u ON u.id = i.imported_by_id
      WHERE i.conversion_id = ? AND i.sha256 = ? AND ${where.connectorId === null ? 'i.connector_id IS NULL' : 'i.connector_id = ?'}
      ORDER BY i.id DESC LIMIT 1`,
    where.connectorId === null
      ? [where.conversionId, sha256]
      : [where.conversionId, sha256, where.connectorId],
  );
  if (!earlier) return null;
  return { at: new Date(storedTime(earlier.at)).toISOString(), by: earlier.importedBy };
}

/**
 * Pins per INSERT: a 5,000-row import is written in 10 statements, each handed to SQLite while it
 * writes the one before (`runBulkWrites`).
 */
const PINS_PER_STATEMENT = 500;

/** The pin columns an import writes, by attribute, in one order for every statement. */
const WRITTEN = ['connectorId', 'cavity', 'position', ...PIN_FIELD_NAMES, 'version'] as const;

/**
 * Where a row's timestamps go in a rendered statement: a control character, which no value can
 * hold (`sqlLiteral` refuses it), replaced by the time of writing when the statement is run.
 */
const STAMP = '\u0001';

/**
 * A plan's pins as multi-row statements, values escaped in, timestamps marked (`STAMP`): plain
 * SQL, no model per row; updated pins take the new values (and keep created_at). A preview renders
 * them once and keeps them with its plan, so the apply that follows only stamps them: escaping
 * 100,000 values was most of an apply's own work (`npm run bench`, P4). A column whose default is
 * NULL is left out of a statement none of whose pins has a value for it (a pinout seldom fills
 * every column): SQLite then reads and compiles less, and an updated pin still takes the NULL, as
 * `excluded.<column>` is the default of a column not given.
 */
async function renderPins(plan: Plan, conversionId: number): Promise<string[]> {
  const attributes = Pin.getAttributes();
  const column = (name: string) => attributes[name as keyof typeof attributes]!.field!;
  const nullByDefault = new Set(
    WRITTEN.filter((name) => {
      const attribute = attributes[name as keyof typeof attributes]!;
      return attribute.allowNull !== false && attribute.defaultValue === undefined;
    }),
  );
  const set = ['position', ...PIN_FIELD_NAMES, 'version', 'updatedAt']
    .map((name) => `${column(name)} = excluded.${column(name)}`)
    .join(', ');
  type Written = Pick<PinData, (typeof WRITTEN)[number]>;
  const statement = (pins: Array<Written & { id?: number }>, upsert: boolean) => {
    const given = WRITTEN.filter(
      (name) => !nullByDefault.has(name) || pins.some((pin) => pin[name] != null),
    );
    const columns = [...(upsert ? ['id'] : []), 'conversionId', ...given, 'createdAt', 'updatedAt']
      .map(column)
      .join(', ');
    const rows = pins.map((pin) => {
      let text = upsert ? `(${sqlLiteral(pin.id)}, ${conversionId}` : `(${conversionId}`;
      for (const name of given) text += `, ${sqlLiteral(pin[name])}`;
      return `${text}, ${STAMP}, ${STAMP})`;
    });
    return (
      `INSERT INTO pins (${columns}) VALUES ${rows.join(', ')}` +
      (upsert ? ` ON CONFLICT (id) DO UPDATE SET ${set}` : '')
    );
  };
  const updates = plan.connectors.flatMap((c) => c.updates);
  const adds = plan.connectors.flatMap((c) =>
    c.adds.map((pin) => ({ ...pin, connectorId: c.connectorId, version: 0 })),
  );
  const statements: string[] = [];
  for (const [pins, upsert] of [
    [updates, true],
    [adds, false],
  ] as const) {
    for (const some of chunks<Written & { id?: number }>(pins, PINS_PER_STATEMENT)) {
      statements.push(statement(some, upsert));
      // Other requests run between statements, as while the plan was worked out.
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
  }
  return statements;
}

/** Rendered statements stamped with the time of writing, each when it is asked for. */
function* stamped(statements: readonly string[]): Generator<string> {
  const stamp = sqlLiteral(new Date());
  for (const sql of statements) yield sql.replaceAll(STAMP, stamp);
}

/**
 * Writes a plan inside the caller's transaction: every removal first (500 ids a statement), then
 * the rendered updates and new pins (500 a statement), so a 13-connector file takes a dozen
 * statements rather than a dozen per connector.
 */
async function writePlan(plan: Plan, statements: string[], t: Transaction): Promise<void> {
  for (const ids of chunks(plan.connectors.flatMap((c) => c.removes))) {
    await Pin.destroy({ where: { id: ids }, transaction: t });
  }
  await runBulkWrites(stamped(statements), t);
  // The plan was worked out on what this transaction reads (see importPinout), connectors included.
  const grown = plan.connectors.filter((c) => c.reshaped);
  if (grown.length === 0) return;
  // Every connector the file grew in one statement; its version moves on as a save would move it.
  const byId = (value: (c: ConnectorPlan) => number) => ({
    sql: `CASE id ${grown.map(() => 'WHEN ? THEN ?').join(' ')} END`,
    values: grown.flatMap((c) => [c.connectorId, value(c)]),
  });
  const set = [byId((c) => c.cavityCount), byId((c) => c.rows), byId((c) => c.columns)];
  await db().query(
    `UPDATE connectors SET cavity_count = ${set[0]!.sql}, "rows" = ${set[1]!.sql}, ` +
      `"columns" = ${set[2]!.sql}, version = version + 1, updated_at = ? ` +
      `WHERE id IN (${grown.map(() => '?').join(', ')})`,
    {
      replacements: [
        ...set.flatMap((s) => s.values),
        new Date(),
        ...grown.map((c) => c.connectorId),
      ],
      transaction: t,
    },
  );
}

/** The conversion's change counter as this transaction sees it (migration 0007). */
async function changeCounterIn(conversionId: number, t: Transaction): Promise<number> {
  const [row] = await db().query<{ counter: number }>(
    'SELECT counter FROM conversion_changes WHERE conversion_id = ?',
    { replacements: [conversionId], type: QueryTypes.SELECT, transaction: t },
  );
  return row?.counter ?? 0;
}

interface Prepared {
  checked: Checked;
  /** The column choices sent with the file, if any. */
  given: Map<string, ColumnTarget> | null;
  plan: Plan | null;
  /** The plan's pins as statements (`renderPins`), when the plan can be applied. */
  statements: string[] | null;
}

/** Previews kept for the apply that follows them (see PreparedImports). */
const prepared = new PreparedImports<Prepared>();

/** Everything a preview's work depends on besides the pin map (which the change counter covers). */
function preparedKey(
  actor: Actor,
  where: Where,
  sha256: string,
  given: Map<string, ColumnTarget> | null,
): string {
  return JSON.stringify([
    actor.workshopId,
    where.conversionId,
    where.connectorId,
    where.sizeUnit,
    sha256,
    given ? [...given] : null,
  ]);
}

/**
 * The kept preview for this key, if the pin map has not moved since and, when the file's columns
 * were matched by the workshop's saved choices, those choices are still what they were.
 */
async function stillPrepared(actor: Actor, key: string, counter: number): Promise<Prepared | null> {
  const hit = prepared.get(key, counter);
  if (!hit || hit.given || !hit.checked.signature) return hit;
  const [saved] = await readRows<{ targets: string }>(
    'SELECT targets_json AS targets FROM import_mappings WHERE workshop_id = ? AND header_signature = ?',
    [actor.workshopId, hit.checked.signature],
  );
  return (saved?.targets ?? null) === hit.checked.savedTargets ? hit : null;
}

/** Checks the file and works out its plan against the pin map as it is now. */
async function prepare(
  actor: Actor,
  where: Where,
  file: UploadedFile,
  sha256: string,
  given: Map<string, ColumnTarget> | null,
): Promise<Prepared> {
  const checked = await checkFile(actor, where, file, sha256, given);
  const plan = checked.rows.length
    ? await planImportYielding(
        await loadContext(where),
        checked.rows,
        checked.mentioned,
        checked.headerOf,
        checked.imported,
      )
    : null;
  const applicable = plan && checked.errors.length === 0 && plan.errors.length === 0;
  return {
    checked,
    given,
    plan,
    statements: applicable ? await renderPins(plan, where.conversionId) : null,
  };
}

/** What an import reads: the uploaded file (with its column choices), or a kept preview's id. */
export type ImportSource = { file: UploadedFile; mapping: unknown } | { previewId: string };

/** Applying by a preview's id when that preview is no longer kept: the file must be sent again. */
function previewGone(): AppError {
  return new AppError(
    409,
    'preview_gone',
    'That preview is no longer kept (the pin map changed, or it is over 15 minutes old). Nothing was imported: send the file again.',
  );
}

/**
 * The work for an import: a kept preview of the same file, choices and place while the pin map has
 * not moved, or the file checked and planned now. By a preview's id, only the kept preview will do.
 */
async function workFor(
  actor: Actor,
  where: Where,
  source: ImportSource,
  counter: number,
  dryRun: boolean,
): Promise<{ key: string; work: Prepared; kept: boolean }> {
  if ('previewId' in source) {
    if (dryRun) throw new AppError(400, 'file_needed', 'A preview needs the file.');
    const key = prepared.keyOf(source.previewId, actor.id);
    // The kept preview's own key, made again for this place: another conversion or connector,
    // another workshop or another size unit never matches.
    const hit = key === null ? null : await stillPrepared(actor, key, counter);
    if (!hit || key !== preparedKey(actor, where, hit.checked.sha256, hit.given)) {
      throw previewGone();
    }
    return { key, work: hit, kept: true };
  }
  const given = parseMappingField(source.mapping);
  const sha256 = createHash('sha256').update(source.file.buffer).digest('hex');
  const key = preparedKey(actor, where, sha256, given);
  const hit = await stillPrepared(actor, key, counter);
  if (hit) return { key, work: hit, kept: true };
  return { key, work: await prepare(actor, where, source.file, sha256, given), kept: false };
}

/**
 * Previews (`dryRun`) or applies a pinout CSV. The file is decoded, parsed and every cell checked
 * before any transaction starts; a file with any problem is refused whole (422) and nothing is
 * written. A preview is kept for its maker: applying it (by its id, or by sending the same file
 * again) reuses its checked rows and plan while the pin map has not moved. A clean file is applied
 * in one transaction; if the pin map moved since the plan was made, the plan is worked out again
 * on what the transaction reads. It is written with one audit event.
 */
export async function importPinout(
  actor: Actor,
  target: ImportTarget,
  source: ImportSource,
  dryRun: boolean,
  page = 1,
  allowGrowth = false,
): Promise<ImportResult> {
  const { where, counter } = await locate(actor, target);
  const { key, work, kept } = await workFor(actor, where, source, counter, dryRun);
  let previewId: string | undefined;
  if (dryRun) {
    previewId =
      (kept && prepared.idOf(key, actor.id)) || prepared.set(key, counter, work, actor.id);
  } else {
    prepared.delete(key);
  }
  // The notes of this answer alone: a kept preview is shared.
  const checked: Checked = { ...work.checked, notes: [...work.checked.notes] };
  const { plan, statements } = work;
  const previous = await previousImport(where, checked.sha256);
  if (previous) {
    checked.notes.push(
      `This same file (SHA-256 ${checked.sha256.slice(0, 12)}…) was imported here on ${previous.at.slice(0, 10)}${previous.by ? ` by ${previous.by}` : ''}. Importing it again changes only what differs now.`,
    );
  }
  const preview = buildResult(where, checked, plan, dryRun, previous, page);
  if (dryRun) return { ...preview, previewId };
  if (preview.errorCount > 0 || !plan) throw refused(preview);
  assertGrowthConfirmed(plan, allowGrowth);

  const applied = await inTransaction(db(), async (t) => {
    const unchanged = (await changeCounterIn(where.conversionId, t)) === counter;
    const fresh = unchanged
      ? plan
      : planImport(
          await loadContext(where, t),
          checked.rows,
          checked.mentioned,
          checked.headerOf,
          checked.imported,
        );
    if (fresh.errors.length) {
      throw refused(buildResult(where, checked, fresh, false, previous));
    }
    assertGrowthConfirmed(fresh, allowGrowth);
    const rendered =
      fresh === plan && statements ? statements : await renderPins(fresh, where.conversionId);
    await writePlan(fresh, rendered, t);
    // A pin the file joins to a feed is one of that feed's loads, and a pin it parts from a feed
    // is no longer one, as when edited on the pin map. (A pin removed holds no load: one that
    // does is refused.)
    await loadsFollowConnectorPins(
      fresh.connectors.filter((c) => c.feedLinksMove).map((c) => c.connectorId),
      t,
    );
    await PinImport.create(
      {
        workshopId: actor.workshopId,
        conversionId: where.conversionId,
        connectorId: where.connectorId,
        fileName: checked.fileName,
        sha256: checked.sha256,
        rowCount: checked.rows.length,
        addedCount: fresh.summary.added,
        changedCount: fresh.summary.changed,
        removedCount: fresh.summary.removed,
        importedById: actor.id,
      },
      { transaction: t },
    );
    if (checked.signature) {
      await saveMapping(actor, checked.signature, checked.headers, checked.mapping, t);
    }
    const { added, changed, removed } = fresh.summary;
    const into = where.label ?? 'the conversion';
    await recordAudit(t, actor, {
      conversionId: where.conversionId,
      action: 'import',
      entityType: where.connectorId === null ? 'conversion' : 'connector',
      entityId: where.connectorId ?? where.conversionId,
      summary: `Imported ${checked.fileName} into ${into}: ${added} added, ${changed} changed, ${removed} removed (${checked.rows.length} rows)`,
      after: {
        fileName: checked.fileName,
        sha256: checked.sha256,
        rows: checked.rows.length,
        added,
        changed,
        removed,
        connectors: fresh.connectors.map((c) => c.label),
      },
    });
    return fresh;
  });
  logger.info(
    {
      requestId: actor.requestId,
      userId: actor.id,
      conversionId: where.conversionId,
      connectorId: where.connectorId,
      rows: checked.rows.length,
      ...applied.summary,
      sha256: checked.sha256,
    },
    'pinout imported',
  );
  return {
    ...buildResult(where, checked, applied, false, previous),
    // Applying answers with the summary: the preview listed every change already.
    changes: [],
    imported: checked.rows.length,
  };
}

async function saveMapping(
  actor: Actor,
  signature: string,
  headers: string[],
  mapping: ImportResult['mapping'],
  t: Transaction,
): Promise<void> {
  const targets = JSON.stringify(mapping.map((m) => m.target));
  const existing = await ImportMapping.findOne({
    where: { workshopId: actor.workshopId, headerSignature: signature },
    transaction: t,
  });
  if (existing) {
    existing.set({
      targetsJson: targets,
      headersJson: JSON.stringify(headers),
      updatedById: actor.id,
    });
    await existing.save({ transaction: t });
  } else {
    await ImportMapping.create(
      {
        workshopId: actor.workshopId,
        headerSignature: signature,
        headersJson: JSON.stringify(headers),
        targetsJson: targets,
        updatedById: actor.id,
      },
      { transaction: t },
    );
  }
}
