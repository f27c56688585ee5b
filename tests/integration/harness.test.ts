/**
 * The harness through the API: the demo's wire list, a feed's drawn circuit, the worksheet's wire
 * list, ends that must stay inside the conversion, version checks, the CSV round trip, and the
 * migration that carries last round's plans over.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { QueryTypes, Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '#server/db/migrations/index.ts';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import type { Wire } from '#shared/schemas/harness.schema.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
let builder: string;
let draft: number;

beforeAll(async () => {
  ctx = await createTestContext();
  builder = await ctx.authFor('builder');
  draft = ctx.demo.conversions.draft;
});
afterAll(() => ctx.close());

const text = (req: request.Test) =>
  req.buffer(true).parse((res, cb) => {
    let body = '';
    res.setEncoding('utf8');
    res.on('data', (c: string) => (body += c));
    res.on('end', () => cb(null, body));
  });

async function wiresOf(conversionId: number): Promise<Wire[]> {
  const res = await request(ctx.app)
    .get(`/api/conversions/${conversionId}/wires`)
    .set('Authorization', builder);
  expect(res.status).toBe(200);
  return res.body.wires as Wire[];
}

async function feedId(name: string) {
  const res = await request(ctx.app)
    .get(`/api/conversions/${draft}/feeds`)
    .set('Authorization', builder);
  return (res.body.feeds as Array<{ id: number; name: string }>).find((f) => f.name === name)!.id;
}

describe('the demo draft’s harness', () => {
  it('has a wire with two ends for every pin joined to a vehicle cavity or a feed', async () => {
    const wires = await wiresOf(draft);
    const pins = (
      await request(ctx.app).get(`/api/conversions/${draft}/pins`).set('Authorization', builder)
    ).body.pins as Array<{
      id: number;
      destinationPinId: number | null;
      destinationFeedId: number | null;
      disposition: string;
    }>;
    const wiredPins = new Set(
      wires.flatMap((w) => w.ends.flatMap((e) => (e.kind === 'pin' ? [e.refId] : []))),
    );
    const joined = pins.filter(
      (p) =>
        (p.destinationPinId != null || p.destinationFeedId != null) &&
        p.disposition !== 'depin' &&
        p.disposition !== 'cut',
    );
    expect(joined.length).toBeGreaterThan(10);
    for (const p of joined) expect(wiredPins.has(p.id)).toBe(true);
    for (const w of wires) expect(w.ends).toHaveLength(2);
    expect(wires[0]!.label).toBe('W-001');
  });

  it('raises the sensor-ground warning through splice S-03 to ground point G-4', async () => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draft}/checks`)
      .set('Authorization', builder);
    const ground = (res.body.findings as Finding[]).find(
      (f) => f.rule === 'sensor_ground_extra_ground',
    );
    expect(ground).toBeDefined();
    expect(ground!.working.join(' ')).toMatch(/E1-19 → W-\d+ → S-03 → W-\d+ → G-4 ground/);
    expect(ground!.values.path?.value).toMatch(/S-03/);
  });

  it('draws the cooling fan’s circuit with its fuse, relay terminals, wires and ground', async () => {
    const fan = await feedId('Cooling fan');
    const res = await text(
      request(ctx.app)
        .get(`/api/conversions/${draft}/circuits/feed/${fan}.svg`)
        .set('Authorization', builder),
    );
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/image\/svg\+xml/);
    const svg = res.body as string;
    expect(svg).toMatch(/30 A green/);
    expect(svg).toMatch(/· out→30</);
    expect(svg).toMatch(/· 87</);
    expect(svg).toMatch(/G-2 ground/);
    // Every wire on the path, by label.
    const wires = await wiresOf(draft);
    const boxes = (
      await request(ctx.app).get(`/api/conversions/${draft}/boxes`).set('Authorization', builder)
    ).body.boxes as Array<{ positions: Array<{ id: number; feedId: number | null }> }>;
    const fanPositions = new Set(
      boxes.flatMap((b) => b.positions.filter((p) => p.feedId === fan).map((p) => p.id)),
    );
    const fanWires = wires.filter((w) =>
      w.ends.some((e) => (e.kind === 'relay' || e.kind === 'fuse') && fanPositions.has(e.refId)),
    );
    expect(fanWires.length).toBeGreaterThanOrEqual(4);
    for (const w of fanWires) expect(svg).toContain(w.label);
  });

  it('prints the wire list with every wire label on the worksheet', async () => {
    const res = await request(ctx.app)
      .get(`/api/conversions/${draft}/worksheet.pdf`)
      .set('Authorization', builder)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    const { execFileSync } = await import('node:child_process');
    const dir = mkdtempSync(path.join(tmpdir(), 'lw-ws-'));
    const file = path.join(dir, 'ws.pdf');
    (await import('node:fs')).writeFileSync(file, res.body as Buffer);
    const pdfText = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
    rmSync(dir, { recursive: true });
    expect(pdfText).toContain('Wire list');
    expect(pdfText).toContain('Circuit drawings');
    for (const w of await wiresOf(draft)) expect(pdfText).toContain(w.label);
  });
});

describe('wires through the API', () => {
  it('creates a wire between a pin and a new ground point, with the next label', async () => {
    const pins = (
      await request(ctx.app).get(`/api/conversions/${draft}/pins`).set('Authorization', builder)
    ).body.pins as Array<{ id: number }>;
    const g = await request(ctx.app)
      .post(`/api/conversions/${draft}/ground-points`)
      .set('Authorization', builder)
      .send({ location: 'body', strapSizeMm2: 6 });
    expect(g.status).toBe(201);
    expect(g.body.groundPoint.label).toBe('G-5');
    const before = await wiresOf(draft);
    const created = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires`)
      .set('Authorization', builder)
      .send({
        colour: 'bk',
        sizeMm2: 1,
        ends: [
          { kind: 'pin', refId: pins[0]!.id },
          { kind: 'ground', refId: g.body.groundPoint.id },
        ],
      });
    expect(created.status).toBe(201);
    expect(created.body.wire.colour).toBe('BK');
    expect(created.body.wire.label).toBe(`W-${String(before.length + 1).padStart(3, '0')}`);

    // A stale version is a 409, and the row is unchanged.
    const first = await request(ctx.app)
      .patch(`/api/wires/${created.body.wire.id}`)
      .set('Authorization', builder)
      .send({ lengthM: 1.2, version: 0 });
    expect(first.status).toBe(200);
    const stale = await request(ctx.app)
      .patch(`/api/wires/${created.body.wire.id}`)
      .set('Authorization', builder)
      .send({ lengthM: 9, version: 0 });
    expect(stale.status).toBe(409);
    const after = (await wiresOf(draft)).find((w) => w.id === created.body.wire.id)!;
    expect(after.lengthM).toBe(1.2);

    const removed = await request(ctx.app)
      .delete(`/api/wires/${created.body.wire.id}`)
      .set('Authorization', builder);
    expect(removed.status).toBe(204);
  });

  it('refuses an end that names another conversion’s pin, writing nothing', async () => {
    const otherPins = (
      await request(ctx.app)
        .get(`/api/conversions/${ctx.demo.conversions.signedOff}/pins`)
        .set('Authorization', builder)
    ).body.pins as Array<{ id: number }>;
    const before = (await wiresOf(draft)).length;
    const res = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires`)
      .set('Authorization', builder)
      .send({
        ends: [
          { kind: 'pin', refId: otherPins[0]!.id },
          { kind: 'source', source: 'battery' },
        ],
      });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/End A: no such pin in this conversion/);
    expect(await wiresOf(draft)).toHaveLength(before);
  });

  it('answers 404 for a wire of another workshop', async () => {
    const other = await createOtherWorkshop();
    const wire = (await wiresOf(draft))[0]!;
    const res = await request(ctx.app)
      .patch(`/api/wires/${wire.id}`)
      .set('Authorization', other.authFor('builder'))
      .send({ notes: 'not mine', version: wire.version });
    expect(res.status).toBe(404);
  });

  it('keeps a technician from changing wires', async () => {
    const wire = (await wiresOf(draft))[0]!;
    const res = await request(ctx.app)
      .patch(`/api/wires/${wire.id}`)
      .set('Authorization', await ctx.authFor('technician'))
      .send({ notes: 'x', version: wire.version });
    expect(res.status).toBe(403);
  });
});

describe('the wire list as CSV', () => {
  it('exports both ends by name and imports back, all or nothing, with row and column', async () => {
    const csv = await text(
      request(ctx.app).get(`/api/conversions/${draft}/wires.csv`).set('Authorization', builder),
    );
    expect(csv.status).toBe(200);
    const body = (csv.body as string).replace(/^\uFEFF/, '');
    const [header, first] = body.split('\r\n');
    expect(header).toBe(
      'label,colour,size_mm2,length_m,zone,end_a,end_b,notes,twist_group,shielded',
    );
    expect(first).toMatch(/^W-001,RD,2\.5,,engine_bay,battery,F1:in,,,no$/);

    const dry = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires/import?dryRun=1`)
      .set('Authorization', builder)
      .attach('file', Buffer.from(body), 'wires.csv');
    expect(dry.status).toBe(200);
    expect(dry.body.errors).toEqual([]);

    const bad = body.replace('battery,F1:in', 'battery,F99:in').replace('W-002,RD', 'W-002,PU');
    const refused = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires/import`)
      .set('Authorization', builder)
      .attach('file', Buffer.from(bad), 'wires.csv');
    expect(refused.status).toBe(422);
    expect(refused.body.errors).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ row: 2, column: 'end_b', message: expect.stringMatching(/F99/) }),
        expect.objectContaining({ row: 3, column: 'colour' }),
      ]),
    );
    const unchanged = await text(
      request(ctx.app).get(`/api/conversions/${draft}/wires.csv`).set('Authorization', builder),
    );
    expect((unchanged.body as string).replace(/^\uFEFF/, '')).toBe(body);
  });
});

describe('migration 0011-harness', () => {
  it('carries last round’s pin destinations and feeds over as wires, losing none', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'lw-mig-'));
    const sequelize = new Sequelize({
      dialect: 'sqlite',
      storage: path.join(dir, 'old.sqlite'),
      logging: false,
    });
    try {
      const harnessIndex = MIGRATIONS.findIndex((m) => m.name === '0011-harness');
      // A database as last round left it: every migration before the harness.
      for (const m of MIGRATIONS.slice(0, harnessIndex)) {
        await sequelize.transaction((t) => m.up(sequelize, t));
      }
      const now = '2026-11-30T10:00:00.000Z';
      for (const sql of [
        `INSERT INTO workshops (id, name, created_at, updated_at) VALUES (1, 'W', '${now}', '${now}')`,
        `INSERT INTO conversions (id, workshop_id, name, donor_engine, receiving_vehicle, system_voltage, created_at, updated_at)
          VALUES (1, 1, 'C', 'KT-20', 'Corran 100', 12, '${now}', '${now}')`,
        `INSERT INTO connectors (id, conversion_id, label, side, cavity_count, rows, columns, created_at, updated_at) VALUES
           (1, 1, 'E1', 'ecu', 3, 1, 3, '${now}', '${now}'), (2, 1, 'V1', 'vehicle', 2, 1, 2, '${now}', '${now}')`,
        `INSERT INTO feeds (id, conversion_id, name, source, fuse_a, has_relay, relay_contact_rating_a, relay_coil_pin_id,
           wire_size_mm2, wire_insulation_rating_c, wire_length_m, wire_zone, wire_return_path, drop_class, created_at, updated_at)
           VALUES (1, 1, 'ECU main', 'battery', 15, 1, 30, NULL, 1.5, 105, 1, 'engine_bay', 'wire', 'critical', '${now}', '${now}')`,
        `INSERT INTO pins (id, conversion_id, connector_id, cavity, position, function, disposition, destination,
           destination_pin_id, destination_feed_id, created_at, updated_at) VALUES
           (5, 1, 2, '1', 0, 'Tacho', 'keep', '', NULL, NULL, '${now}', '${now}'),
           (6, 1, 2, '2', 1, 'Spare', 'empty', '', NULL, NULL, '${now}', '${now}'),
           (1, 1, 1, '1', 0, 'Tach out', 'join', '', 5, NULL, '${now}', '${now}'),
           (2, 1, 1, '2', 1, 'ECU power', 'join', '', NULL, 1, '${now}', '${now}'),
           (3, 1, 1, '3', 2, 'Lamp', 'extend', 'New dash lamp', NULL, NULL, '${now}', '${now}')`,
      ]) {
        await sequelize.query(sql);
      }
      await sequelize.transaction((t) => MIGRATIONS[harnessIndex]!.up(sequelize, t));

      const ends = await sequelize.query<{
        label: string;
        end_index: number;
        kind: string;
        pin_id: number | null;
        terminal: string | null;
        text: string;
      }>(
        `SELECT w.label, e.end_index, e.kind, e.pin_id, e.terminal, e.text FROM wires w
           JOIN wire_ends e ON e.wire_id = w.id ORDER BY w.label, e.end_index`,
        { type: QueryTypes.SELECT },
      );
      const wire = (pinId: number) => {
        const label = ends.find((e) => e.kind === 'pin' && e.pin_id === pinId)?.label;
        return ends.filter((e) => e.label === label);
      };
      // The pin linked to a vehicle cavity: one wire, pin to pin.
      expect(wire(1).map((e) => [e.kind, e.pin_id])).toEqual([
        ['pin', 1],
        ['pin', 5],
      ]);
      // The pin joined to the feed: from the feed's relay output.
      expect(wire(2).map((e) => [e.kind, e.terminal ?? e.pin_id])).toEqual([
        ['relay', '87'],
        ['pin', 2],
      ]);
      // Words only: a wire with its far end still to be fastened, the words kept.
      expect(wire(3).map((e) => [e.kind, e.text || e.pin_id])).toEqual([
        ['pin', 3],
        ['unresolved', 'New dash lamp'],
      ]);
      // The feed: battery to fuse, fuse to relay 30, the coil's two wires.
      const feedWires = ends.filter((e) => e.kind === 'source' || e.terminal === '30');
      expect(feedWires.length).toBeGreaterThanOrEqual(3);
      // And the pins keep their destinations.
      const pins = await sequelize.query<{
        id: number;
        destination_pin_id: number | null;
        destination_feed_id: number | null;
        destination: string;
      }>('SELECT id, destination_pin_id, destination_feed_id, destination FROM pins ORDER BY id', {
        type: QueryTypes.SELECT,
      });
      expect(pins.slice(0, 3)).toEqual([
        { id: 1, destination_pin_id: 5, destination_feed_id: null, destination: '' },
        { id: 2, destination_pin_id: null, destination_feed_id: 1, destination: '' },
        {
          id: 3,
          destination_pin_id: null,
          destination_feed_id: null,
          destination: 'New dash lamp',
        },
      ]);
    } finally {
      await sequelize.close();
      rmSync(dir, { recursive: true });
    }
  });
});

describe('signal rules on the demo', () => {
  it('find the tach with no pull-up, the CAN bus with one termination, the shield grounded twice and the cut purge valve, each with values, sources and a fix', async () => {
    const res = await request(ctx.app)
      .post(`/api/conversions/${draft}/checks`)
      .set('Authorization', builder);
    const findings = res.body.findings as Finding[];
    const rule = (r: string) => findings.find((f) => f.rule === r);
    for (const [r, fix] of [
      ['pulse_no_pull_up', /Fit a pull-up resistor/],
      ['can_termination', /fit a 120 Ω terminator/],
      ['shield_grounded_far_end', /leave the far end of the drain unconnected/],
      ['regulated_circuit_removed', /check the local rules/],
    ] as const) {
      const f = rule(r);
      expect(f, r).toBeDefined();
      expect(Object.keys(f!.values).length, r).toBeGreaterThan(0);
      expect(f!.sources.length, r).toBeGreaterThan(0);
      expect(f!.message, r).toMatch(fix);
    }
    const signedOff = await request(ctx.app)
      .post(`/api/conversions/${ctx.demo.conversions.signedOff}/checks`)
      .set('Authorization', builder);
    const signedOffFindings = signedOff.body.findings as Finding[];
    expect(signedOffFindings.filter((f) => f.severity === 'error')).toEqual([]);
    // The signed-off plan runs its CAN pair twisted; the draft does not yet.
    expect(signedOffFindings.some((f) => f.rule === 'can_pair_untwisted')).toBe(false);
    expect(rule('can_pair_untwisted')?.message).toMatch(/same twist group/);
  });

  it('clears the CAN pair finding once both wires share a twist group, by the API and by CSV', async () => {
    const pairFinding = async () =>
      (
        (
          await request(ctx.app)
            .post(`/api/conversions/${draft}/checks`)
            .set('Authorization', builder)
        ).body.findings as Finding[]
      ).find((f) => f.rule === 'can_pair_untwisted');
    const found = await pairFinding();
    expect(found?.working).toHaveLength(2);
    const labels = found!.working.map((line) => line.split(':')[0]!);
    const wires = (await wiresOf(draft)).filter((w) => labels.includes(w.label));
    expect(wires).toHaveLength(2);

    // One wire twisted by the API: the other is still loose.
    const patched = await request(ctx.app)
      .patch(`/api/wires/${wires[0]!.id}`)
      .set('Authorization', builder)
      .send({ twistGroup: 'T1', version: wires[0]!.version });
    expect(patched.status).toBe(200);
    expect(patched.body.wire.twistGroup).toBe('T1');
    expect((await pairFinding())?.working).toHaveLength(2);

    // The other by CSV, with a bad shielded cell first: refused with row and column, nothing written.
    const header = 'label,end_a,end_b,twist_group,shielded';
    const ends = async (w: Wire) => {
      const csv = await text(
        request(ctx.app).get(`/api/conversions/${draft}/wires.csv`).set('Authorization', builder),
      );
      const row = (csv.body as string).split('\r\n').find((l) => l.startsWith(`${w.label},`))!;
      return row.split(',').slice(5, 7).join(',');
    };
    const line = `${wires[1]!.label},${await ends(wires[1]!)}`;
    const refused = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires/import`)
      .set('Authorization', builder)
      .attach('file', Buffer.from(`${header}\r\n${line},T1,maybe\r\n`), 'wires.csv');
    expect(refused.status).toBe(422);
    expect(refused.body.errors).toEqual([expect.objectContaining({ row: 2, column: 'shielded' })]);
    // Hostile text in a text cell is refused as the API would refuse it, named by row and column.
    const hostile = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires/import`)
      .set('Authorization', builder)
      .attach(
        'file',
        Buffer.from(`${header},notes\r\n${line},T\u200B1,no,"15 A\u202E fuse"\r\n`),
        'wires.csv',
      );
    expect(hostile.status).toBe(422);
    expect(hostile.body.errors).toEqual([
      expect.objectContaining({
        row: 2,
        column: 'twist_group',
        message: expect.stringMatching(/U\+200B/),
      }),
      expect.objectContaining({
        row: 2,
        column: 'notes',
        message: expect.stringMatching(/U\+202E/),
      }),
    ]);
    const imported = await request(ctx.app)
      .post(`/api/conversions/${draft}/wires/import`)
      .set('Authorization', builder)
      .attach('file', Buffer.from(`${header}\r\n${line},T1,yes\r\n`), 'wires.csv');
    expect(imported.status).toBe(200);
    expect(await pairFinding()).toBeUndefined();
    const after = (await wiresOf(draft)).find((w) => w.id === wires[1]!.id)!;
    // Columns the file left out (colour, size, notes) are kept, not blanked.
    expect(after).toMatchObject({
      twistGroup: 'T1',
      shielded: true,
      colour: wires[1]!.colour,
      sizeMm2: wires[1]!.sizeMm2,
    });
  });
});

describe('a pin’s destination and its wire are one fact', () => {
  it('moves the wire when the destination moves, frees its end when cleared, and wires a new destination', async () => {
    const pins = (
      await request(ctx.app).get(`/api/conversions/${draft}/pins`).set('Authorization', builder)
    ).body.pins as Array<{ id: number; cavity: string; connectorId: number; version: number }>;
    const connectors = (
      await request(ctx.app)
        .get(`/api/conversions/${draft}/connectors`)
        .set('Authorization', builder)
    ).body.connectors as Array<{ id: number; label: string }>;
    const pinAt = (name: string) => {
      const [label, cavity] = name.split('-');
      const c = connectors.find((x) => x.label === label)!;
      return pins.find((p) => p.connectorId === c.id && p.cavity === cavity)!;
    };
    const tach = pinAt('E2-12');
    const wireOfTach = async () =>
      (await wiresOf(draft)).filter((w) =>
        w.ends.some((e) => e.kind === 'pin' && e.refId === tach.id),
      );
    const [before] = await wireOfTach();
    expect(before!.ends).toContainEqual({ kind: 'pin', refId: pinAt('V1-3').id });

    const moved = await request(ctx.app)
      .patch(`/api/pins/${tach.id}`)
      .set('Authorization', builder)
      .send({ destinationPinId: pinAt('DLC-8').id, version: tach.version });
    expect(moved.status).toBe(200);
    const [after] = await wireOfTach();
    expect(after!.id).toBe(before!.id);
    expect(after!.ends).toContainEqual({ kind: 'pin', refId: pinAt('DLC-8').id });
    expect(after!.version).toBe(before!.version + 1);

    const cleared = await request(ctx.app)
      .patch(`/api/pins/${tach.id}`)
      .set('Authorization', builder)
      .send({ destinationPinId: null, version: moved.body.pin.version });
    expect(cleared.status).toBe(200);
    const [loose] = await wireOfTach();
    expect(loose!.ends).toContainEqual({ kind: 'unresolved', text: 'was DLC-8' });

    // A pin with no wire at all gets one when it is given a destination.
    const spare = pinAt('E1-40');
    expect(
      (await wiresOf(draft)).some((w) =>
        w.ends.some((e) => e.kind === 'pin' && e.refId === spare.id),
      ),
    ).toBe(false);
    const linked = await request(ctx.app)
      .patch(`/api/pins/${spare.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'join', destinationPinId: pinAt('DLC-9').id, version: spare.version });
    expect(linked.status).toBe(200);
    const added = (await wiresOf(draft)).find((w) =>
      w.ends.some((e) => e.kind === 'pin' && e.refId === spare.id),
    );
    expect(added?.ends).toEqual([
      { kind: 'pin', refId: spare.id },
      { kind: 'pin', refId: pinAt('DLC-9').id },
    ]);

    // Put the draft back as it was for the tests after this one.
    await request(ctx.app)
      .delete(`/api/wires/${added!.id}`)
      .set('Authorization', builder)
      .expect(204);
    await request(ctx.app)
      .patch(`/api/pins/${spare.id}`)
      .set('Authorization', builder)
      .send({ disposition: 'empty', destinationPinId: null, version: linked.body.pin.version })
      .expect(200);
  });
});

describe('removing splices and ground points', () => {
  it('removes one no wire is fastened to, refuses one that joins wires, and hides another workshop’s', async () => {
    const added = await request(ctx.app)
      .post(`/api/conversions/${draft}/splices`)
      .set('Authorization', builder)
      .send({ notes: 'Made by mistake' });
    expect(added.status).toBe(201);
    const other = await createOtherWorkshop();
    const foreign = await request(ctx.app)
      .delete(`/api/conversions/${draft}/splices/${added.body.splice.id}`)
      .set('Authorization', other.authFor('builder'));
    expect(foreign.status).toBe(404);
    const removed = await request(ctx.app)
      .delete(`/api/conversions/${draft}/splices/${added.body.splice.id}`)
      .set('Authorization', builder);
    expect(removed.status).toBe(204);
    const splices = (
      await request(ctx.app).get(`/api/conversions/${draft}/splices`).set('Authorization', builder)
    ).body.splices as Array<{ id: number; label: string }>;
    expect(splices.some((s) => s.id === added.body.splice.id)).toBe(false);

    // G-1 holds the block's ground wires: refused, and nothing is removed.
    const grounds = (
      await request(ctx.app)
        .get(`/api/conversions/${draft}/ground-points`)
        .set('Authorization', builder)
    ).body.groundPoints as Array<{ id: number; label: string }>;
    const g1 = grounds.find((g) => g.label === 'G-1')!;
    const before = await wiresOf(draft);
    const refused = await request(ctx.app)
      .delete(`/api/conversions/${draft}/ground-points/${g1.id}`)
      .set('Authorization', builder);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/^G-1 still joins \d+ wires/);
    expect(await wiresOf(draft)).toEqual(before);
  });
});
