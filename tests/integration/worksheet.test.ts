import { CONNECTOR_SIDE_LABELS } from '#shared/schemas/pin-map.schema.ts';
/**
 * The bench worksheet of the demo conversions, printed through the API and read back with pdfjs.
 * Expected values come from the plan as the API lists it, not from the worksheet code.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '#shared/auth/roles.ts';
import type { Feed } from '#shared/schemas/feeds.schema.ts';
import type { TestPlanResponse } from '#shared/schemas/test-plan.schema.ts';
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';
import type { WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { createOtherWorkshop } from '../factories/workshop.factory.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';
import { readPdf, type PdfPage } from '../unit/worksheet/pdf-text.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

const worksheetPath = (id: number) => `/api/conversions/${id}/worksheet.pdf`;

/** Collects the raw body, whatever its type. */
function binary(res: unknown, done: (err: Error | null, body: Buffer) => void) {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (chunk: Buffer) => chunks.push(chunk));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

async function print(id: number, role: Role = 'technician') {
  return request(ctx.app)
    .get(worksheetPath(id))
    .set('Authorization', await ctx.authFor(role))
    .buffer(true)
    .parse(binary);
}

async function plan(id: number) {
  const auth = await ctx.authFor('builder');
  const get = (path: string) =>
    request(ctx.app).get(`/api/conversions/${id}${path}`).set('Authorization', auth);
  const [conversion, connectors, pins, feeds, workshop] = await Promise.all([
    get(''),
    get('/connectors'),
    get('/pins'),
    get('/feeds'),
    request(ctx.app).get('/api/workshop').set('Authorization', auth),
  ]);
  return {
    conversion: conversion.body.conversion as {
      name: string;
      donorEngine: string;
      receivingVehicle: string;
    },
    connectors: connectors.body.connectors as Connector[],
    pins: pins.body.pins as Pin[],
    feeds: feeds.body.feeds as Feed[],
    workshop: workshop.body.workshop as WorkshopSettings,
  };
}

describe('GET /api/conversions/:id/worksheet.pdf, the current draft', () => {
  let pages: PdfPage[];
  let data: Awaited<ReturnType<typeof plan>>;

  beforeAll(async () => {
    const res = await print(ctx.demo.conversions.draft);
    expect(res.status).toBe(200);
    pages = await readPdf(res.body as Buffer);
    data = await plan(ctx.demo.conversions.draft);
  }, 60_000);

  it('is a PDF shown inline under a safe name, never sniffed', async () => {
    const res = await print(ctx.demo.conversions.draft, 'reviewer');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toBe(
      'inline; filename="ashby-yard-truck-draft-worksheet.pdf"',
    );
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cache-control']).toBe('no-store');
    expect((res.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  }, 30_000);

  it('prints for every role of the workshop', async () => {
    for (const role of ['admin', 'builder'] as Role[]) {
      expect((await print(ctx.demo.conversions.draft, role)).status).toBe(200);
    }
  }, 30_000);

  it('has the header, DRAFT and "page X of Y" on every page', () => {
    expect(pages.length).toBeGreaterThanOrEqual(8);
    const printed = /printed (\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC)/.exec(pages[0]!.text)?.[1];
    expect(printed).toBeDefined();
    pages.forEach((page, i) => {
      expect(page.text).toContain(data.workshop.name);
      expect(page.text).toContain(data.conversion.name);
      expect(page.text).toContain(
        `${data.conversion.donorEngine} → ${data.conversion.receivingVehicle}`,
      );
      expect(page.text).toContain(`printed ${printed}`);
      expect(page.text).toContain('Content hash not frozen');
      expect(page.items).toContain('DRAFT');
      expect(page.text.match(/page \d+ of \d+/g)).toEqual([`page ${i + 1} of ${pages.length}`]);
    });
  });

  it('prints every pin of every connector in cavity order, with its function', () => {
    const items = pages.flatMap((p) => p.items);
    for (const connector of data.connectors) {
      const start = items.indexOf(
        `Connector ${connector.label}, ${CONNECTOR_SIDE_LABELS[connector.side]}`,
      );
      expect(start, connector.label).toBeGreaterThan(-1);
      const pins = data.pins
        .filter((p) => p.connectorId === connector.id)
        .sort((a, b) => a.position - b.position);
      let at = items.indexOf('Measured', start);
      for (const pin of pins) {
        // Each row starts with its cavity, then the first line of its function.
        let found = -1;
        for (let i = at + 1; i < items.length; i++) {
          const next = items[i + 1] ?? '';
          const fits = pin.function
            ? pin.function.startsWith(next) && next !== ''
            : next === 'Empty cavity';
          if (items[i] === pin.cavity && fits) {
            found = i;
            break;
          }
        }
        expect(found, `${connector.label}-${pin.cavity}`).toBeGreaterThan(at);
        at = found;
      }
    }
  });

  it('totals the cut list as the plan adds up, plus the service allowance', () => {
    // Feed wires at their length, a return wire again for two-wire feeds, and the recorded runs
    // of extended and joined pins.
    const feedsM = data.feeds.reduce(
      (s, f) => s + f.wire.lengthM * (f.wire.returnPath === 'wire' ? 2 : 1),
      0,
    );
    const pinsM = data.pins
      .filter((p) => (p.disposition === 'extend' || p.disposition === 'join') && p.runLengthM)
      .reduce((s, p) => s + p.runLengthM!, 0);
    const total = feedsM + pinsM;
    const pct = data.workshop.serviceAllowancePct;
    const cut = total * (1 + pct / 100);
    expect(total).toBeGreaterThan(0);
    const text = pages.map((p) => p.text).join('\n');
    expect(text).toContain(`${total.toFixed(2)} m + ${pct} % = ${cut.toFixed(2)} m`);
  });

  it('lists the open findings and the fuse of every feed', () => {
    const text = pages.map((p) => p.text).join('\n');
    expect(text).toContain('Open findings');
    expect(text).toContain('Fuse does not protect the wire');
    for (const feed of data.feeds) expect(text).toContain(feed.name);
    expect(text).toContain('Disconnect the battery');
    expect(text).toContain('Local codes and licensed practice prevail');
  });

  it('answers 404 for another workshop’s conversion, both ways', async () => {
    const other = await createOtherWorkshop();
    const theirs = await request(ctx.app)
      .get(worksheetPath(ctx.demo.conversions.draft))
      .set('Authorization', other.authFor('technician'));
    expect(theirs.status).toBe(404);
    expect(theirs.headers['content-type']).toMatch(/json/);
    const ours = await request(ctx.app)
      .get(worksheetPath(other.conversion.id))
      .set('Authorization', await ctx.authFor('technician'));
    expect(ours.status).toBe(404);
  });

  it('asks for a session', async () => {
    expect((await request(ctx.app).get(worksheetPath(ctx.demo.conversions.draft))).status).toBe(
      401,
    );
  });
});

describe('paper size', () => {
  it('follows the workshop setting: A4, then US Letter', async () => {
    const a4 = await readPdf((await print(ctx.demo.conversions.signedOff)).body as Buffer);
    for (const page of a4) {
      expect(page.width).toBeCloseTo(595.28, 1);
      expect(page.height).toBeCloseTo(841.89, 1);
    }
    const admin = await ctx.authFor('admin');
    const { body } = await request(ctx.app).get('/api/workshop').set('Authorization', admin);
    await request(ctx.app)
      .patch('/api/workshop')
      .set('Authorization', admin)
      .send({ paperSize: 'Letter', version: body.workshop.version })
      .expect(200);
    const letter = await readPdf((await print(ctx.demo.conversions.signedOff)).body as Buffer);
    for (const page of letter) {
      expect(page.width).toBeCloseTo(612, 1);
      expect(page.height).toBeCloseTo(792, 1);
      expect(page.text).toContain('Pellow farm flatbed');
    }
  }, 60_000);
});

describe('GET /api/conversions/:id/revisions/:number/worksheet.pdf', () => {
  const revisionPath = (id: number, n: number) =>
    `/api/conversions/${id}/revisions/${n}/worksheet.pdf`;

  it('prints a signed-off revision from its frozen snapshot: reviewer, date and hash, no DRAFT', async () => {
    const id = ctx.demo.conversions.signedOff;
    const revision = (
      await request(ctx.app)
        .get(`/api/conversions/${id}/revisions/1`)
        .set('Authorization', await ctx.authFor('technician'))
    ).body.revision as { hash: string; reviewedBy: string };
    // The live plan moves on after sign-off; the revision's sheet must not.
    const pins = (await plan(id)).pins;
    await request(ctx.app)
      .patch(`/api/pins/${pins[0]!.id}`)
      .set('Authorization', await ctx.authFor('builder'))
      .send({ function: 'Changed after sign-off', version: pins[0]!.version })
      .expect(200);
    const res = await request(ctx.app)
      .get(revisionPath(id, 1))
      .set('Authorization', await ctx.authFor('technician'))
      .buffer(true)
      .parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe(
      'inline; filename="pellow-farm-flatbed-rev1-worksheet.pdf"',
    );
    const pages = await readPdf(res.body as Buffer);
    const all = pages.map((p) => p.text).join('\n');
    expect(all).toContain(revision.reviewedBy);
    expect(all).toContain(revision.hash.slice(0, 12));
    expect(all).not.toContain('Changed after sign-off');
    for (const page of pages) expect(page.text).not.toMatch(/\bDRAFT\b/);
    // The test plan is printed: every wire's expected resistance and limit as the API gives them.
    const testPlan = (
      await request(ctx.app)
        .get(`/api/conversions/${id}/revisions/1/test-plan`)
        .set('Authorization', await ctx.authFor('technician'))
    ).body as TestPlanResponse;
    const first = pages.findIndex((p) => p.text.includes('ECU unplugged, battery disconnected'));
    expect(first).toBeGreaterThan(0);
    const planText = pages
      .slice(first)
      .map((p) => p.text)
      .join('\n');
    expect(planText).toContain('Key on, ECU plugged in');
    expect(planText).toContain('First start');
    const wires = testPlan.plan.steps.filter((s) => s.phase === 'unplugged' && s.unit === 'Ω');
    expect(wires.length).toBeGreaterThan(3);
    for (const w of wires) expect(planText).toContain(w.limitText);
  }, 60_000);

  it('answers 404 for an unknown revision and for another workshop', async () => {
    const unknown = await request(ctx.app)
      .get(revisionPath(ctx.demo.conversions.signedOff, 9))
      .set('Authorization', await ctx.authFor('technician'));
    expect(unknown.status).toBe(404);
    const other = await createOtherWorkshop();
    const across = await request(ctx.app)
      .get(revisionPath(ctx.demo.conversions.signedOff, 1))
      .set('Authorization', other.authFor('technician'));
    expect(across.status).toBe(404);
  });
});
