/**
 * Pinout CSV import and export (issue 6; reliability rows 13, 15, 18, 19): real, messy files are
 * read or refused whole, nothing is ever half-imported, and export → import loses nothing.
 */
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_IMPORT_ROWS, type ImportResult } from '#shared/schemas/imports.schema.ts';
import { BLANK_PIN_VALUES, type Pin } from '#shared/schemas/pin-map.schema.ts';
import { db } from '#server/db/index.ts';
import {
  AuditEvent,
  Connector,
  Pin as PinModel,
  PinImport,
  User,
} from '#server/db/models/index.ts';
import { feedBody } from '../factories/feed.factory.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, onPostgres, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let conversionId: number;
let x1: number;

const BOM = '\uFEFF';

async function createConversion(name: string): Promise<number> {
  const res = await request(ctx.app)
    .post('/api/conversions')
    .set('Authorization', builder)
    .send({ name, donorEngine: 'KT-20', receivingVehicle: 'Corran 100', systemVoltage: 12 });
  return res.body.conversion.id as number;
}

async function createConnector(
  conversion: number,
  label: string,
  side: string,
  cavityCount: number,
): Promise<number> {
  const res = await request(ctx.app)
    .post(`/api/conversions/${conversion}/connectors`)
    .set('Authorization', builder)
    .send({ label, side, cavityCount });
  expect(res.status).toBe(201);
  return res.body.connector.id as number;
}

function upload(
  path: string,
  content: string | Buffer,
  options: {
    dryRun?: boolean;
    mapping?: object;
    auth?: string;
    filename?: string;
    grow?: boolean;
  } = {},
) {
  const req = request(ctx.app)
    .post(options.dryRun ? `${path}?dryRun=1` : options.grow ? `${path}?grow=1` : path)
    .set('Authorization', options.auth ?? builder)
    .attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), {
      filename: options.filename ?? 'pinout.csv',
      contentType: 'text/csv',
    });
  if (options.mapping) req.field('mapping', JSON.stringify(options.mapping));
  return req;
}

const intoConnector = (id: number) => `/api/connectors/${id}/import`;
const intoConversion = (id: number) => `/api/conversions/${id}/import`;

async function pinsOf(conversion: number): Promise<Pin[]> {
  const res = await request(ctx.app)
    .get(`/api/conversions/${conversion}/pins`)
    .set('Authorization', builder);
  return res.body.pins as Pin[];
}

/** Everything that would show a write: counts, every version, the audit trail and import log. */
async function writeState() {
  const [versions] = await db().query(
    'SELECT (SELECT COUNT(*) FROM pins) AS pins, (SELECT SUM(version) FROM pins) AS pinVersions, ' +
      '(SELECT SUM(version) FROM connectors) AS connectorVersions, (SELECT SUM(cavity_count) FROM connectors) AS cavities',
  );
  return {
    versions,
    audit: await AuditEvent.count(),
    imports: await PinImport.count(),
  };
}

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  conversionId = await createConversion('Import test');
  x1 = await createConnector(conversionId, 'X1', 'ecu', 3);
  await createConnector(conversionId, 'V1', 'vehicle', 4);
});
afterAll(() => ctx.close());

/** BOM, semicolons, quoted delimiters and quotes, CRLF, blank lines, an extra column, one bad
 * colour (line 5), one bad disposition (line 6), a duplicate cavity (line 8). */
const MESSY =
  BOM +
  [
    'Cavity;Function;Colour;Size_mm2;Disposition;Destination;Remarks',
    '1;"Main relay; coil control";BU/GN;0,5;Join to vehicle circuit;Relay R1 terminal 85;checked',
    '',
    '2;"ECU feed ""A""";RD;1,5;keep;;',
    '3;Tacho out;PU;0,5;join;V1-3;bad colour',
    '4;Spare;;;remove;;bad disposition',
    '',
    '2;Duplicate;BK;0,5;keep;;dup',
    '5;"Notes with\r\ntwo lines";BK;0,5;Cut and insulate;;',
  ].join('\r\n') +
  '\r\n';

const FIXED = MESSY.replace('3;Tacho out;PU', '3;Tacho out;GN')
  .replace('4;Spare;;;remove', '4;Spare;;;De-pin')
  .replace('2;Duplicate;BK;0,5;keep;;dup\r\n', '');

describe('a messy pinout file', () => {
  it('previews every problem by line and column, with the rows as read', async () => {
    const res = await upload(intoConnector(x1), MESSY, { dryRun: true });
    expect(res.status).toBe(200);
    const result = res.body as ImportResult;
    expect(result.dryRun).toBe(true);
    expect(result.rows).toBe(6);
    expect(result.imported).toBe(0);
    expect(result.errors.map((e) => [e.row, e.column])).toEqual([
      [5, 'Colour'],
      [6, 'Disposition'],
      [8, 'Cavity'],
    ]);
    expect(result.errors[0]!.message).toContain('"PU" is not a wire colour');
    expect(result.errors[0]!.message).toContain('BK, BN, RD');
    expect(result.errors[1]!.message).toContain('"remove" is not a disposition');
    expect(result.errors[1]!.message).toContain('depin (De-pin)');
    expect(result.errors[2]!.message).toContain('already on line 4');
    expect(result.notes.join(' ')).toMatch(/byte-order mark/);
    expect(result.notes.join(' ')).toMatch(/semicolons/);
    expect(result.notes.join(' ')).toMatch(/2 blank lines were skipped/);
    expect(result.notes.join(' ')).toMatch(/"Remarks" is not imported/);
    expect(result.mapping.find((m) => m.header === 'Remarks')?.target).toBe('ignore');
    expect(result.table!.map((r) => r.row)).toEqual([2, 4, 5, 6, 8, 9]);
    expect(result.table![0]!.cells[1]).toBe('Main relay; coil control');
    expect(result.table![5]!.cells[1]).toBe('Notes with\ntwo lines');
  });

  it('is refused whole when applied: 422 with the same errors, and nothing is written', async () => {
    const before = await writeState();
    const res = await upload(intoConnector(x1), MESSY);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('import_refused');
    expect(
      res.body.error.details.errors.map((e: { row: number; column: string }) => [e.row, e.column]),
    ).toEqual([
      [5, 'Colour'],
      [6, 'Disposition'],
      [8, 'Cavity'],
    ]);
    expect(await writeState()).toEqual(before);
  });

  it('imports once fixed: cavities added, fields set, a vehicle cavity linked, one audit event', async () => {
    const auditBefore = await AuditEvent.count();
    const preview = await upload(intoConnector(x1), FIXED, { dryRun: true });
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.summary).toEqual({ added: 2, changed: 3, unchanged: 0, removed: 0 });
    // Cavities 4 and 5 are not on the 3-cavity X1: the preview says so, and applying waits for a yes.
    expect(preview.body.growth).toEqual([
      { connector: 'X1', cavityCount: 3, cavities: ['4', '5'] },
    ]);
    const unconfirmed = await writeState();
    const refused = await upload(intoConnector(x1), FIXED);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('confirm_growth');
    expect(refused.body.error.message).toContain('X1: adds cavities 4, 5 to a 3-cavity connector');
    expect(await writeState()).toEqual(unconfirmed);
    const res = await upload(intoConnector(x1), FIXED, { grow: true });
    expect(res.status).toBe(200);
    expect(res.body.imported).toBe(5);
    const pins = (await pinsOf(conversionId)).filter((p) => p.connectorId === x1);
    expect(pins.map((p) => [p.cavity, p.position])).toEqual([
      ['1', 0],
      ['2', 1],
      ['3', 2],
      ['4', 3],
      ['5', 4],
    ]);
    const v1cavity3 = (await pinsOf(conversionId)).find(
      (p) => p.connectorId !== x1 && p.cavity === '3',
    )!;
    expect(pins[0]).toMatchObject({
      function: 'Main relay; coil control',
      colour: 'BU/GN',
      sizeMm2: 0.5,
      disposition: 'join',
      destination: 'Relay R1 terminal 85',
    });
    expect(pins[1]!.function).toBe('ECU feed "A"');
    expect(pins[2]).toMatchObject({ destination: '', destinationPinId: v1cavity3.id });
    expect(pins[3]!.disposition).toBe('depin');
    expect(pins[4]).toMatchObject({ function: 'Notes with\ntwo lines', disposition: 'cut' });
    const connector = await Connector.findByPk(x1);
    expect(connector!.cavityCount).toBe(5);
    expect(connector!.rows * connector!.columns).toBeGreaterThanOrEqual(5);
    const audit = await AuditEvent.findAll({ where: { action: 'import' } });
    expect(await AuditEvent.count()).toBe(auditBefore + 1);
    expect(audit.at(-1)!.summary).toContain(
      'Imported pinout.csv into X1: 2 added, 3 changed, 0 removed',
    );
  });

  it('applied again (same SHA-256), changes nothing and says it has seen the file', async () => {
    const other = await createConnector(conversionId, 'X1B', 'ecu', 3);
    const before = await writeState();
    const res = await upload(intoConnector(x1), FIXED);
    expect(res.status).toBe(200);
    expect(res.body.changes).toEqual([]);
    expect(res.body.summary).toEqual({ added: 0, changed: 0, unchanged: 5, removed: 0 });
    // When and by whom, from the import before: the builder, within the last hour.
    const builderName = (await User.findByPk(ctx.demo.users.builder!))!.name;
    expect(res.body.previousImport).toEqual({ at: expect.any(String), by: builderName });
    const at = Date.parse(res.body.previousImport.at);
    expect(Math.abs(Date.now() - at)).toBeLessThan(3_600_000);
    expect(res.body.notes.join(' ')).toMatch(
      new RegExp(
        `This same file .* was imported here on ${res.body.previousImport.at.slice(0, 10)} by ${builderName}\\.`,
      ),
    );
    // The same file into another connector was never imported there.
    const elsewhere = await upload(intoConnector(other), FIXED, { dryRun: true });
    expect(elsewhere.body.previousImport).toBeNull();
    const after = await writeState();
    expect(after.versions).toEqual(before.versions);
    expect(after.imports).toBe(before.imports + 1);
  });
});

describe('feeds joined by a file', () => {
  it("makes a joined pin one of the feed's loads, drops it when the file parts them, and leaves loads alone otherwise", async () => {
    const conversion = await createConversion('Feed loads by file');
    const connector = await createConnector(conversion, 'F1', 'ecu', 2);
    const created = await request(ctx.app)
      .post(`/api/conversions/${conversion}/feeds`)
      .set('Authorization', builder)
      .send(feedBody({ name: 'Fuel pump', loads: [] }));
    expect(created.status).toBe(201);
    const feedId = created.body.feed.id as number;
    const loadsOf = async () =>
      (
        (
          await request(ctx.app)
            .get(`/api/conversions/${conversion}/feeds/${feedId}`)
            .set('Authorization', builder)
        ).body.feed.loads as Array<{ pinId: number | null; name: string }>
      ).map((l) => [l.pinId, l.name]);
    const pinIdOf = async (cavity: string) =>
      (await pinsOf(conversion)).find((p) => p.cavity === cavity && p.connectorId === connector)!
        .id;

    /** The feed's loads after the file is applied to F1. */
    const loadsAfter = async (file: string, grow = false) => {
      const res = await upload(intoConnector(connector), file, { grow });
      expect(res.status).toBe(200);
      return loadsOf();
    };

    expect(
      await loadsAfter('cavity,function,feed\n1,Pump relay out,Fuel pump\n2,Spare,\n'),
    ).toEqual([[await pinIdOf('1'), 'Pump relay out']]);
    // A file that leaves the feed column as it was (here: without it) changes no load.
    expect(await loadsAfter('cavity,function\n1,Pump out\n2,Spare\n')).toEqual([
      [await pinIdOf('1'), 'Pump relay out'],
    ]);
    // The feed moves to cavity 2: the load follows the pin that is joined now.
    expect(await loadsAfter('cavity,function,feed\n1,Pump out,\n2,Pump feed,Fuel pump\n')).toEqual([
      [await pinIdOf('2'), 'Pump feed'],
    ]);
    // A new cavity the file adds and joins to the feed is a load from the start.
    const file =
      'cavity,function,feed\n1,Pump out,\n2,Pump feed,Fuel pump\n3,Second pump,Fuel pump\n';
    expect(await loadsAfter(file, true)).toEqual([
      [await pinIdOf('2'), 'Pump feed'],
      [await pinIdOf('3'), 'Second pump'],
    ]);
  });
});

describe('importing into a connector that already has pins', () => {
  it('clears a value the file leaves blank, also when no pin in the file has one', async () => {
    const connector = await createConnector(conversionId, 'X6', 'engine', 2);
    const [a, b] = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    for (const pin of [a!, b!]) {
      const res = await request(ctx.app)
        .patch(`/api/pins/${pin.id}`)
        .set('Authorization', builder)
        .send({ version: pin.version, sizeMm2: 1.5, runLengthM: 2, driverType: 'low_side' });
      expect(res.status).toBe(200);
    }
    // Size blank in every row; run length kept in one row only; driver type blank in both.
    const file = 'cavity,function,size_mm2,run_length_m,driver_type\n1,Coil 1,,2.5,\n2,Coil 2,,,\n';
    const res = await upload(intoConnector(connector), file);
    expect(res.status).toBe(200);
    const after = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    expect(after.map((p) => [p.function, p.sizeMm2, p.runLengthM, p.driverType])).toEqual([
      ['Coil 1', null, 2.5, null],
      ['Coil 2', null, null, null],
    ]);
  });

  it('previews removals of blank cavities and refuses to drop ones that hold data', async () => {
    const connector = await createConnector(conversionId, 'X2', 'engine', 4);
    const pins = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    await request(ctx.app)
      .patch(`/api/pins/${pins[3]!.id}`)
      .set('Authorization', builder)
      .send({ version: pins[3]!.version, function: 'Knock sensor' });

    const file = 'cavity,function\n1,Coil 1\n2,Coil 2\n';
    const refused = await upload(intoConnector(connector), file, { dryRun: true });
    expect(refused.body.errors).toEqual([
      expect.objectContaining({
        row: null,
        message: expect.stringContaining('X2: cavity 4 is not in the file but holds'),
      }),
    ]);
    expect(refused.body.changes.filter((c: { kind: string }) => c.kind === 'remove')).toEqual([
      expect.objectContaining({ cavity: '3', blank: true }),
    ]);
    expect((await upload(intoConnector(connector), file)).status).toBe(422);

    const withFour = 'cavity,function\n1,Coil 1\n2,Coil 2\n4,Knock sensor\n';
    const res = await upload(intoConnector(connector), withFour);
    expect(res.status).toBe(200);
    expect(res.body.summary).toEqual({ added: 0, changed: 2, unchanged: 1, removed: 1 });
    const after = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    expect(after.map((p) => [p.cavity, p.position])).toEqual([
      ['1', 0],
      ['2', 1],
      ['4', 2],
    ]);
    expect((await Connector.findByPk(connector))!.cavityCount).toBe(3);
  });

  it('shows a change field by field, and only for the columns the file has', async () => {
    const connector = await createConnector(conversionId, 'X3', 'engine', 1);
    await upload(
      intoConnector(connector),
      'cavity,function,colour,notes\n1,Cam sensor,YE,keep dry\n',
    );
    const res = await upload(intoConnector(connector), 'cavity,colour\n1,YE/BU\n', {
      dryRun: true,
    });
    expect(res.body.changes).toEqual([
      expect.objectContaining({
        kind: 'change',
        cavity: '1',
        fields: [{ field: 'colour', label: 'Colour', before: 'YE', after: 'YE/BU' }],
      }),
    ]);
  });
});

describe('applying right after a preview', () => {
  it('works on the pin map as it is when applied, not as it was previewed', async () => {
    const connector = await createConnector(conversionId, 'X7', 'engine', 2);
    const file = 'cavity,function\n1,Crank sensor\n2,Cam sensor\n';
    const preview = await upload(intoConnector(connector), file, { dryRun: true });
    expect(preview.body.summary).toEqual({ added: 0, changed: 2, unchanged: 0, removed: 0 });
    // Someone types one of the file's values by hand between the preview and the Import button.
    const [first] = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    const edited = await request(ctx.app)
      .patch(`/api/pins/${first!.id}`)
      .set('Authorization', builder)
      .send({ version: first!.version, function: 'Crank sensor' });
    expect(edited.status).toBe(200);
    const applied = await upload(intoConnector(connector), file);
    expect(applied.status).toBe(200);
    expect(applied.body.summary).toEqual({ added: 0, changed: 1, unchanged: 1, removed: 0 });
    const after = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    expect(after.map((p) => [p.function, p.version])).toEqual([
      ['Crank sensor', edited.body.pin.version],
      ['Cam sensor', 1],
    ]);
  });

  it('reads the columns again when the workshop’s saved choices changed since the preview', async () => {
    const connector = await createConnector(conversionId, 'X8', 'engine', 1);
    const file = 'Slot,Label,Note\n1,Boost sensor,dry\n';
    await upload(intoConnector(connector), file, {
      mapping: { Slot: 'cavity', Label: 'function', Note: 'ignore' },
    });
    const preview = await upload(intoConnector(connector), file, { dryRun: true });
    expect(preview.body.mappingSource).toBe('saved');
    expect(preview.body.summary).toEqual({ added: 0, changed: 0, unchanged: 1, removed: 0 });
    // An import of a file with the same columns into another conversion (this pin map stays as
    // it was) saves different choices in between.
    const other = await createConnector(await createConversion('Same columns'), 'Y1', 'engine', 1);
    await upload(intoConnector(other), 'Slot,Label,Note\n1,Spare,keep clear\n', {
      mapping: { Slot: 'cavity', Label: 'function', Note: 'notes' },
    });
    const applied = await upload(intoConnector(connector), file);
    expect(applied.status).toBe(200);
    expect(applied.body.summary).toEqual({ added: 0, changed: 1, unchanged: 0, removed: 0 });
    const [pin] = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    expect([pin!.function, pin!.notes]).toEqual(['Boost sensor', 'dry']);
  });
});

describe('applying a preview by its id', () => {
  const applyById = (path: string, previewId: string, auth = builder, grow = false) =>
    request(ctx.app)
      .post(`${path}?preview=${previewId}${grow ? '&grow=1' : ''}`)
      .set('Authorization', auth);

  it('writes what the preview showed without the file, once', async () => {
    const connector = await createConnector(conversionId, 'X9', 'engine', 1);
    const file = 'cavity,function,colour\n1,Knock sensor,BK\n2,Knock sensor return,BK/WH\n';
    const preview = await upload(intoConnector(connector), file, { dryRun: true });
    expect(preview.body.previewId).toMatch(/^[0-9a-f-]{36}$/);
    // Another page of the same preview names the same kept preview.
    const again = await upload(intoConnector(connector), file, { dryRun: true });
    expect(again.body.previewId).toBe(preview.body.previewId);
    // The file grows X9 by a cavity: the id does not stand in for that confirmation.
    const unconfirmed = await applyById(intoConnector(connector), preview.body.previewId);
    expect(unconfirmed.status).toBe(409);
    expect(unconfirmed.body.error.code).toBe('confirm_growth');
    const preview2 = await upload(intoConnector(connector), file, { dryRun: true });
    const applied = await applyById(
      intoConnector(connector),
      preview2.body.previewId,
      builder,
      true,
    );
    expect(applied.status).toBe(200);
    expect(applied.body.imported).toBe(2);
    const pins = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    expect(pins.map((p) => [p.cavity, p.function, p.colour])).toEqual([
      ['1', 'Knock sensor', 'BK'],
      ['2', 'Knock sensor return', 'BK/WH'],
    ]);
    const audit = await AuditEvent.findAll({ where: { action: 'import', entityId: connector } });
    expect(audit).toHaveLength(1);
    // Applied once: the id is spent, and nothing is written twice.
    const twice = await applyById(intoConnector(connector), preview2.body.previewId, builder, true);
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('preview_gone');
  });

  it('is refused (409, nothing written) once the pin map moved, for someone else, or elsewhere', async () => {
    const connector = await createConnector(conversionId, 'X10', 'engine', 2);
    const file = 'cavity,function\n1,Oil pressure\n2,Oil temperature\n';
    const before = await writeState();
    const gone = async (res: request.Response) => {
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('preview_gone');
      expect(res.body.error.message).toContain('send the file again');
      expect(await writeState()).toEqual(before);
    };
    const { previewId } = (await upload(intoConnector(connector), file, { dryRun: true })).body;
    // Another person of the same workshop who may import, and another place in this conversion.
    await gone(await applyById(intoConnector(connector), previewId, await ctx.authFor('admin')));
    await gone(await applyById(intoConnector(x1), previewId));
    await gone(await applyById(intoConversion(conversionId), previewId));
    // Someone else's workshop cannot see the connector at all.
    const other = await createOtherWorkshop();
    const theirs = await applyById(intoConnector(connector), previewId, other.authFor('builder'));
    expect(theirs.status).toBe(404);
    // A preview is not made by id, and an id must look like one.
    const dry = await request(ctx.app)
      .post(`${intoConnector(connector)}?dryRun=1&preview=${previewId}`)
      .set('Authorization', builder);
    expect(dry.status).toBe(400);
    expect((await applyById(intoConnector(connector), 'not-an-id')).status).toBe(400);
    // A pin edited after the preview: the kept plan is no longer the plan.
    const [first] = (await pinsOf(conversionId)).filter((p) => p.connectorId === connector);
    await request(ctx.app)
      .patch(`/api/pins/${first!.id}`)
      .set('Authorization', builder)
      .send({ version: first!.version, notes: 'checked' })
      .expect(200);
    const moved = await writeState();
    const res = await applyById(intoConnector(connector), previewId);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('preview_gone');
    expect(await writeState()).toEqual(moved);
    // Sending the file again still works.
    expect((await upload(intoConnector(connector), file)).status).toBe(200);
  });
});

describe('large files', () => {
  it('imports a clean 2,000-row file across five connectors in one go', async () => {
    const conversion = await createConversion('Two thousand');
    for (let c = 1; c <= 5; c++) await createConnector(conversion, `G${c}`, 'ecu', 1);
    let csv = 'connector,cavity,function,colour,size_mm2,disposition\n';
    for (let c = 1; c <= 5; c++) {
      for (let i = 1; i <= 400; i++) csv += `G${c},${i},Circuit ${c}.${i},BU/WH,0.5,keep\n`;
    }
    const res = await upload(intoConversion(conversion), csv, { grow: true });
    expect(res.status).toBe(200);
    expect(res.body.imported).toBe(2000);
    expect(res.body.summary).toEqual({ added: 1995, changed: 5, unchanged: 0, removed: 0 });
    // Applying answers with the summary; the preview is where each change is listed.
    expect(res.body.changes).toEqual([]);
    const pins = await pinsOf(conversion);
    expect(pins).toHaveLength(2000);
    expect(pins.every((p) => p.disposition === 'keep' && p.colour === 'BU/WH')).toBe(true);
    // Each connector grew to its 400 cavities, its version moved on once, as an edit would.
    const grown = await Connector.findAll({
      where: { conversionId: conversion },
      order: [['id', 'ASC']],
    });
    expect(grown.map((c) => [c.cavityCount, c.rows * c.columns >= 400, c.version])).toEqual(
      Array(5).fill([400, true, 1]),
    );
  });

  it('stores text that looks like SQL, quotes or placeholders exactly as written, previewed or not', async () => {
    // The multi-row statements carry their values escaped into the text: every character a cell
    // may hold has to come back unchanged, in new pins and in updated ones.
    const hostile = [
      `O'Neill's relay; '); DELETE FROM pins; --`,
      'Sensor ? $1 :name @p ?1 ?? end',
      "Back\\slash \\' and \\0 and \\n literally",
      '"Double" quotes, 日本語 and 🚗 (non-BMP)',
      `''''`,
    ];
    const conversion = await createConversion('Quoted');
    await createConnector(conversion, 'Q1', 'ecu', 1);
    const file = (suffix: string) => {
      let csv = 'connector,cavity,function,destination,notes\n';
      for (let i = 1; i <= 300; i++) {
        const text = hostile[i % hostile.length]!;
        csv += `Q1,${i},"${text.replaceAll('"', '""')}${suffix}",Point ${i}?,"${text.replaceAll('"', '""')}"\n`;
      }
      return csv;
    };
    const expectStored = async (suffix: string) => {
      const pins = await pinsOf(conversion);
      expect(pins).toHaveLength(300);
      for (const pin of pins) {
        const text = hostile[Number(pin.cavity) % hostile.length]!;
        expect([pin.function, pin.destination, pin.notes]).toEqual([
          `${text}${suffix}`,
          `Point ${pin.cavity}?`,
          text,
        ]);
      }
    };
    // Applied without a preview: every pin but the first is new.
    const first = await upload(intoConversion(conversion), file(''), { grow: true });
    expect(first.status).toBe(200);
    expect(first.body.summary).toMatchObject({ added: 299, changed: 1 });
    await expectStored('');
    // Previewed, then applied: the preview's rows are the ones written, now as updates.
    const preview = await upload(intoConversion(conversion), file(' (2)'), { dryRun: true });
    expect(preview.body.errors).toEqual([]);
    const second = await upload(intoConversion(conversion), file(' (2)'));
    expect(second.status).toBe(200);
    expect(second.body.summary).toMatchObject({ added: 0, changed: 300 });
    await expectStored(' (2)');
  });

  it('refuses more than 400 cavities on one connector (MAX_CAVITIES stays)', async () => {
    const connector = await createConnector(conversionId, 'X4', 'ecu', 1);
    let csv = 'cavity\n';
    for (let i = 1; i <= 401; i++) csv += `${i}\n`;
    const res = await upload(intoConnector(connector), csv);
    expect(res.status).toBe(422);
    expect(res.body.error.details.errors[0].message).toContain('X4 would have 401 cavities');
  });

  it('rolls back every row when a write fails near the end (throw at row 1,999 → 0 rows)', async () => {
    const conversion = await createConversion('Rollback');
    const connectors = [];
    for (let c = 1; c <= 5; c++)
      connectors.push(await createConnector(conversion, `R${c}`, 'ecu', 1));
    let csv = 'connector,cavity,function\n';
    for (let c = 1; c <= 5; c++) {
      for (let i = 1; i <= 400; i++) csv += `R${c},C${i},Row ${(c - 1) * 400 + i}\n`;
    }
    if (onPostgres) {
      await db().query(
        `CREATE FUNCTION fail_late() RETURNS trigger LANGUAGE plpgsql AS $$
           BEGIN RAISE EXCEPTION 'simulated failure'; END $$`,
      );
      await db().query(
        `CREATE TRIGGER fail_late BEFORE INSERT ON pins FOR EACH ROW
           WHEN (NEW.function = 'Row 1999') EXECUTE FUNCTION fail_late()`,
      );
    } else {
      await db().query(
        `CREATE TRIGGER fail_late BEFORE INSERT ON pins WHEN NEW.function = 'Row 1999'
         BEGIN SELECT RAISE(ABORT, 'simulated failure'); END`,
      );
    }
    try {
      const before = await writeState();
      const res = await upload(intoConversion(conversion), csv);
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(JSON.stringify(res.body)).not.toMatch(/SQLITE|simulated|INSERT/);
      expect(await writeState()).toEqual(before);
      expect(await PinModel.count({ where: { conversionId: conversion } })).toBe(5);
    } finally {
      await db().query(onPostgres ? 'DROP FUNCTION fail_late CASCADE' : 'DROP TRIGGER fail_late');
    }
  });

  it('previews a page of lines at a time, with whole-file counts and the pages that hold problems', async () => {
    const p1 = await createConnector(conversionId, 'P1', 'ecu', 1);
    const lines = Array.from(
      { length: 350 },
      (_, i) => `${i + 1},Pin ${i + 1},${i === 299 ? 'NOT A COLOUR' : 'BK'}`,
    );
    const file = ['cavity,function,colour', ...lines].join('\n') + '\n';
    const page = (n?: number) =>
      request(ctx.app)
        .post(`${intoConnector(p1)}?dryRun=1${n === undefined ? '' : `&page=${n}`}`)
        .set('Authorization', builder)
        .attach('file', Buffer.from(file), { filename: 'long.csv', contentType: 'text/csv' });

    const first = await page();
    expect(first.status).toBe(200);
    const body = first.body as ImportResult;
    expect(body.rows).toBe(350);
    expect(body.errorCount).toBe(1);
    expect(body.page).toEqual({ number: 1, count: 2, size: 200, withProblems: [2] });
    expect(body.table!.map((r) => r.row)).toEqual(Array.from({ length: 200 }, (_, i) => i + 2));
    expect(body.errors).toEqual([]); // the one problem is on page 2
    expect(body.summary.added + body.summary.changed).toBe(349);
    expect(body.changes.every((c) => c.kind === 'remove' || (c.row >= 2 && c.row <= 201))).toBe(
      true,
    );

    const second = (await page(2)).body as ImportResult;
    expect(second.table![0]!.row).toBe(202);
    expect(second.errors).toEqual([expect.objectContaining({ row: 301, column: 'colour' })]);
    const last = (await page(99)).body as ImportResult;
    expect(last.page!.number).toBe(2);
    expect(last.table).toHaveLength(150);
    expect((await page(0)).status).toBe(400);
  });

  it('takes 20,000 pin rows and answers 413 too_many_rows to 20,001, writing nothing', async () => {
    const file = (rows: number) =>
      ['connector,cavity,function']
        .concat(Array.from({ length: rows }, (_, i) => `X1,${i + 1},f`))
        .join('\n') + '\n';
    const atCap = await upload(intoConversion(conversionId), file(MAX_IMPORT_ROWS), {
      dryRun: true,
    });
    expect(atCap.status).toBe(200);
    expect(atCap.body.rows).toBe(MAX_IMPORT_ROWS);
    const before = await writeState();
    for (const dryRun of [true, false]) {
      const over = await upload(intoConversion(conversionId), file(MAX_IMPORT_ROWS + 1), {
        dryRun,
      });
      expect(over.status).toBe(413);
      expect(over.body.error.code).toBe('too_many_rows');
      expect(over.body.error.message).toContain('more than 20,000 pin rows');
    }
    expect(await writeState()).toEqual(before);
  });

  it('answers 413 for a file over 2 MB and reads nothing', async () => {
    const big = Buffer.alloc(2 * 1024 * 1024 + 1, 'a');
    const res = await upload(intoConnector(x1), big, { dryRun: true });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toContain('2 MB');
  });
});

describe('files that cannot be read', () => {
  it('refuses invalid UTF-8 naming the byte offset, with 0 rows and no U+FFFD stored', async () => {
    const before = await writeState();
    const bytes = Buffer.concat([
      Buffer.from('cavity,function\n1,Caf', 'utf8'),
      Buffer.from([0xe9]),
      Buffer.from(' relay\n', 'utf8'),
    ]);
    const res = await upload(intoConnector(x1), bytes);
    expect(res.status).toBe(422);
    expect(res.body.error.details.rows).toBe(0);
    expect(res.body.error.details.errors[0].message).toContain('byte 21 (0xE9, on line 2)');
    const preview = await upload(intoConnector(x1), Buffer.from([0x63, 0xff, 0x0a]), {
      dryRun: true,
    });
    expect(preview.status).toBe(200);
    expect(preview.body.errors[0].message).toContain('byte 1 (0xFF');
    expect(await writeState()).toEqual(before);
    const [row] = await db().query<{ n: number }>(
      `SELECT COUNT(*) AS n FROM pins WHERE function || notes || destination || cavity LIKE :replacement`,
      { type: QueryTypes.SELECT, replacements: { replacement: '%\uFFFD%' } },
    );
    expect(row!.n).toBe(0);
  });

  it('refuses a __proto__ header', async () => {
    for (const header of ['__proto__', 'constructor']) {
      const res = await upload(intoConnector(x1), `cavity,${header}\n1,x\n`);
      expect(res.status).toBe(422);
      expect(res.body.error.details.errors).toContainEqual(
        expect.objectContaining({
          row: 1,
          column: header,
          message: expect.stringContaining('not allowed'),
        }),
      );
    }
  });

  it('refuses a file papaparse cannot read cleanly (a quote left open)', async () => {
    const res = await upload(intoConnector(x1), 'cavity,function\n1,"open\n2,x\n');
    expect(res.status).toBe(422);
    expect(res.body.error.details.errors[0].message).toContain('never closed');
  });

  it('answers 400 to a cut-off multipart body and keeps serving', async () => {
    const boundary = 'lwboundary';
    const body =
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="p.csv"\r\n` +
      'Content-Type: text/csv\r\n\r\ncavity\n1\n2';
    const res = await request(ctx.app)
      .post(`${intoConnector(x1)}?dryRun=1`)
      .set('Authorization', builder)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_upload');
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });

  it('answers 400 without a file, and to a malformed mapping', async () => {
    const none = await request(ctx.app)
      .post(intoConnector(x1))
      .set('Authorization', builder)
      .field('mapping', '{}');
    expect(none.status).toBe(400);
    const bad = await upload(intoConnector(x1), 'cavity\n1\n', {
      mapping: ['x'] as unknown as object,
    });
    expect(bad.status).toBe(400);
  });
});

describe('column choices', () => {
  it('takes a mapping for unfamiliar headers and offers it again next time', async () => {
    const connector = await createConnector(conversionId, 'X5', 'ecu', 2);
    const file = 'Pin No;Circuit;Wire\n1;Injector 1;BU/WH\n2;Injector 2;BU/RD\n';
    const first = await upload(intoConnector(connector), file, { dryRun: true });
    expect(first.body.mappingSource).toBe('detected');
    expect(first.body.errors[0].message).toContain('No column is set to Cavity');
    const mapping = { 'Pin No': 'cavity', Circuit: 'function', Wire: 'colour' };
    const applied = await upload(intoConnector(connector), file, { mapping });
    expect(applied.status).toBe(200);
    const next = await upload(
      intoConnector(connector),
      file.replace('Injector 2', 'Injector two'),
      {
        dryRun: true,
      },
    );
    expect(next.body.mappingSource).toBe('saved');
    expect(next.body.errors).toEqual([]);
    expect(next.body.changes).toEqual([expect.objectContaining({ kind: 'change', cavity: '2' })]);
    // Another workshop does not get this workshop's choices.
    const other = await createOtherWorkshop();
    const theirs = await Connector.create({
      conversionId: other.conversion.id,
      label: 'Z1',
      side: 'ecu',
      cavityCount: 1,
      rows: 1,
      columns: 1,
    });
    const res = await upload(intoConnector(theirs.id), file, {
      dryRun: true,
      auth: other.authFor('builder'),
    });
    expect(res.body.mappingSource).toBe('detected');
  });
});

describe('who may import', () => {
  it('a technician or reviewer cannot import (403); another workshop’s connector is a 404', async () => {
    for (const role of ['technician', 'reviewer'] as const) {
      const res = await upload(intoConnector(x1), 'cavity\n1\n', { auth: await ctx.authFor(role) });
      expect(res.status).toBe(403);
    }
    const other = await createOtherWorkshop();
    const res = await upload(intoConnector(x1), 'cavity\n1\n', {
      dryRun: true,
      auth: other.authFor('builder'),
    });
    expect(res.status).toBe(404);
    const exp = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/pins.csv`)
      .set('Authorization', other.authFor('admin'));
    expect(exp.status).toBe(404);
  });
});

describe('export', () => {
  it('writes RFC 4180 UTF-8 with a BOM, and guards formula cells', async () => {
    const pins = (await pinsOf(conversionId)).filter((p) => p.connectorId === x1);
    await request(ctx.app)
      .patch(`/api/pins/${pins[0]!.id}`)
      .set('Authorization', builder)
      .send({ version: pins[0]!.version, function: '=HYPERLINK("x")', notes: '@SUM(A1)' });
    const res = await request(ctx.app)
      .get(`/api/conversions/${conversionId}/pins.csv`)
      .set('Authorization', await ctx.authFor('technician'))
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toBe('attachment; filename="Import-test-pins.csv"');
    const body = res.body as Buffer;
    expect([...body.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const text = body.toString('utf8').slice(1);
    expect(text.split('\r\n')[0]).toBe(
      'connector,cavity,function,signal_class,colour,size_mm2,awg,insulation_c,disposition,destination,feed,run_length_m,load_current_a,driver_type,driver_rated_a,pulse_signal,pulses_per_rev,termination_ohm,notes',
    );
    expect(text).toContain(`X1,1,"'=HYPERLINK(""x"")",`);
    expect(text).toContain(`,'@SUM(A1)\r\n`);
    expect(text).toContain('X1,3,Tacho out,none,GN,0.5,,,join,V1-3,');
  });

  it('gives a template with the canonical headers and an example row that imports cleanly', async () => {
    const res = await request(ctx.app)
      .get('/api/pinouts/template.csv')
      .set('Authorization', await ctx.authFor('reviewer'));
    expect(res.status).toBe(200);
    const text = res.text.replace(/^\uFEFF/, '');
    const [header, example] = text.split('\r\n');
    expect(header).toBe(
      'cavity,function,signal_class,colour,size_mm2,awg,insulation_c,disposition,destination,feed,run_length_m,load_current_a,driver_type,driver_rated_a,pulse_signal,pulses_per_rev,termination_ohm,notes',
    );
    expect(example).toContain('ECU main feed 1');
    const connector = await createConnector(ctx.demo.conversions.draft, 'T1', 'ecu', 1);
    const preview = await upload(intoConnector(connector), res.text, { dryRun: true });
    expect(preview.body.errors).toEqual([]);
    expect(preview.body.changes[0].fields).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ field: 'destinationFeedId', after: 'ECU main' }),
        expect.objectContaining({ field: 'disposition', after: 'Join to vehicle circuit' }),
      ]),
    );
  });

  it('round-trips every field of every pin: export → blank the pins → import → same pins and same file', async () => {
    const conversion = ctx.demo.conversions.draft;
    const e1 = (await pinsOf(conversion)).find(
      (p) => p.cavity === '1' && p.function.startsWith('Injector'),
    )!;
    const tricky = await request(ctx.app)
      .patch(`/api/pins/${e1.id}`)
      .set('Authorization', builder)
      .send({
        version: e1.version,
        function: '=HYPERLINK("http://example.com","click")',
        notes: 'Line one, with "quotes";\nline two\t(tab)\n-5 V ref',
        sizeMm2: 0.823,
        insulationRatingC: 125,
        runLengthM: 2.25,
        loadCurrentA: 0.4,
      });
    expect(tricky.status).toBe(200);
    const exportCsv = async () =>
      (
        await request(ctx.app)
          .get(`/api/conversions/${conversion}/pins.csv`)
          .set('Authorization', builder)
      ).text;
    const comparable = (pins: Pin[]) => pins.map(({ version: _v, updatedAt: _u, ...rest }) => rest);

    // Green-yellow is IEC 60757's one combined code: it must survive the round trip too.
    const spare = (await pinsOf(conversion)).find((p) => p.disposition === 'empty')!;
    await request(ctx.app)
      .patch(`/api/pins/${spare.id}`)
      .set('Authorization', builder)
      .send({ version: spare.version, colour: 'gnye' })
      .expect(200);
    const original = await pinsOf(conversion);
    expect(original.some((p) => p.colour === 'GNYE')).toBe(true);
    expect(original.some((p) => p.destinationPinId !== null)).toBe(true);
    expect(original.some((p) => p.destinationFeedId !== null)).toBe(true);
    const file = await exportCsv();
    expect(file).toContain(',18,125,');

    await PinModel.update(BLANK_PIN_VALUES, { where: { conversionId: conversion } });
    const res = await upload(intoConversion(conversion), file, { filename: 'export.csv' });
    expect(res.status).toBe(200);
    expect(res.body.errors).toEqual([]);
    expect(res.body.summary.removed).toBe(0);
    expect(comparable(await pinsOf(conversion))).toEqual(comparable(original));
    expect(await exportCsv()).toBe(file);
  });
});
