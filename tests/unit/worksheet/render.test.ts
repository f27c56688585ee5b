/**
 * The renderer on its own, without the database: pagination of a big plan, the marks of a draft
 * and of a revision, paper sizes, and text no one should type but someone will.
 */
import { describe, expect, it } from 'vitest';
import type { ConversionSnapshot } from '#shared/schemas/snapshot.schema.ts';
import { renderRevisionWorksheet, worksheetBuffer } from '#server/modules/worksheets/pdf/render.ts';
import { bigSnapshot, HASH, meta, signedOffRevision } from './fixtures.ts';
import { readPdf, type PdfPage } from './pdf-text.ts';

async function revisionBuffer(input: Parameters<typeof renderRevisionWorksheet>[0]) {
  const doc = await renderRevisionWorksheet(input);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise((resolve) => doc.on('end', resolve));
  doc.end();
  await done;
  return Buffer.concat(chunks);
}

function expectPageNumbers(pages: PdfPage[]) {
  pages.forEach((page, i) => {
    expect(page.text.match(/page (\d+) of (\d+)/g), `page ${i + 1}`).toEqual([
      `page ${i + 1} of ${pages.length}`,
    ]);
  });
}

describe('a 300-pin worksheet', () => {
  const snapshot = bigSnapshot(300);
  let pages: PdfPage[];

  it('paginates with the header and "page X of Y" on every page', async () => {
    pages = await readPdf(await worksheetBuffer({ snapshot, meta: meta() }));
    // Three connectors of 100 pins at about 30 rows a page, plus the other sections.
    expect(pages.length).toBeGreaterThan(12);
    expect(pages.length).toBeLessThan(40);
    for (const page of pages) {
      expect(page.text).toContain('Harrow Lane Engine Works');
      expect(page.text).toContain('Generated conversion');
      expect(page.text).toContain('KT-20 2.0 L turbo I4 → Corran 100 flatbed');
      expect(page.text).toContain('Content hash not frozen');
      expect(page.text).toContain('printed 2025-06-01 14:32 UTC');
      expect(page.items).toContain('DRAFT');
    }
    expectPageNumbers(pages);
  }, 60_000);

  it('prints every pin, cavity then function, in its connector table', () => {
    const items = pages.flatMap((p) => p.items);
    for (const pin of snapshot.pins) {
      const label = snapshot.connectors.find((c) => c.id === pin.connectorId)!.label;
      const found = items.some(
        (item, i) =>
          item === pin.cavity &&
          // An empty cavity has no function: its disposition follows.
          (pin.function ? items[i + 1] === pin.function : items[i + 1] === 'Empty cavity'),
      );
      expect(found, `${label}-${pin.cavity}`).toBe(true);
    }
  });

  it('repeats the table header on the pages a table continues onto', () => {
    const continued = pages.filter((p) => p.text.includes('G2 pins (continued)'));
    expect(continued.length).toBeGreaterThan(0);
    for (const page of continued) expect(page.text).toContain('Cavity Function Colour Size');
  });
});

describe('a revision', () => {
  const snapshot = bigSnapshot(40);

  it('is never marked DRAFT, and shows its number, status and hash on every page', async () => {
    const pages = await readPdf(
      await revisionBuffer({
        snapshot,
        meta: { ...meta({ paperSize: 'Letter' }), revision: signedOffRevision(4) },
      }),
    );
    for (const page of pages) {
      expect(page.text).not.toMatch(/DRAFT/);
      expect(page.text).toContain('Revision 4 · signed off');
      expect(page.text).toContain(`Content hash ${HASH.slice(0, 12)}`);
      expect(page.width).toBeCloseTo(612, 1);
      expect(page.height).toBeCloseTo(792, 1);
    }
    expect(pages[0]!.text).toContain('Dana Whitlow');
    expect(pages[0]!.text).toContain('2025-05-30 08:15 UTC');
    expect(pages[0]!.items.join('')).toContain(HASH);
    expectPageNumbers(pages);
  }, 30_000);

  it('in review is marked NOT SIGNED OFF and leaves the sign-off to be written', async () => {
    const pages = await readPdf(
      await revisionBuffer({
        snapshot,
        meta: {
          ...meta(),
          revision: { number: 5, status: 'in_review', hash: HASH, signOff: null },
        },
      }),
    );
    for (const page of pages) {
      expect(page.text).not.toMatch(/DRAFT/);
      expect(page.items).toContain('NOT SIGNED OFF');
      expect(page.text).toContain('Revision 5 · in review');
    }
    expect(pages[0]!.text).toContain('Reviewer Date Signature');
  }, 30_000);

  it('says so when the signed hash is not the content hash', async () => {
    const revision = signedOffRevision(6);
    revision.signOff!.hash = 'f'.repeat(64);
    const pages = await readPdf(await revisionBuffer({ snapshot, meta: { ...meta(), revision } }));
    expect(pages[0]!.text).toContain('does not match this content');
  }, 30_000);
});

describe('paper', () => {
  it('is A4 portrait when the workshop says A4', async () => {
    const pages = await readPdf(await worksheetBuffer({ snapshot: bigSnapshot(20), meta: meta() }));
    for (const page of pages) {
      expect(page.width).toBeCloseTo(595.28, 1);
      expect(page.height).toBeCloseTo(841.89, 1);
    }
  }, 30_000);
});

describe('hostile text', () => {
  const word = 'Lqzjv'.repeat(1000);
  const arabic = ['مضخة', 'الوقود', 'الخلفية'];
  const hostile = (): ConversionSnapshot => {
    const s = bigSnapshot(12);
    s.conversion.name = `Truck \u0000${arabic.join(' ')} 🚚 ${'N'.repeat(300)}`;
    s.pins[0]!.function = word;
    s.pins[1]!.function = `Fan relay\u0000\u0007 ${arabic.join(' ')} 🔥 end`;
    s.pins[1]!.notes = `\u202Eevil\u0000 ${arabic[0]} ${'x'.repeat(3000)}`;
    s.pins[2]!.destination = `🔥${'Wxy'.repeat(1700)}`;
    return s;
  };

  it('renders in a few seconds and the text is still there', async () => {
    const pages = await readPdf(await worksheetBuffer({ snapshot: hostile(), meta: meta() }));
    const all = pages.map((p) => p.text).join('\n');
    // The long word, capped at 2,000 characters, line by line in its cell (and across a page).
    const printed = pages
      .flatMap((p) => p.items)
      .map((item) => /^[Lqzjv]{3,}/.exec(item)?.[0] ?? '')
      .join('');
    expect(printed).toBe(word.slice(0, 2000));
    expect(all).toContain('[3000 more characters not printed]');
    for (const w of arabic) expect(all).toContain(w);
    expect(all).toContain('Fan relay');
    expect(all).toContain('\uFFFD');
    for (const control of ['\u0000', '\u0007', '\u202E']) expect(all).not.toContain(control);
    expectPageNumbers(pages);
    for (const page of pages) expect(page.text).toContain('Harrow Lane Engine Works');
  }, 20_000);
});

describe('several at once', () => {
  it('lays out side by side with the shared fonts and caches, each sheet whole', async () => {
    const one = bigSnapshot(60);
    const two = bigSnapshot(20);
    two.conversion.name = 'Second conversion';
    const [a, b, c] = await Promise.all([
      worksheetBuffer({ snapshot: one, meta: meta() }),
      worksheetBuffer({ snapshot: two, meta: meta({ paperSize: 'Letter' }) }),
      worksheetBuffer({ snapshot: one, meta: meta() }),
    ]);
    const [pa, pb, pc] = await Promise.all([readPdf(a), readPdf(b), readPdf(c)]);
    expect(pa.map((p) => p.text)).toEqual(pc.map((p) => p.text));
    for (const page of pb) {
      expect(page.text).toContain('Second conversion');
      expect(page.width).toBeCloseTo(612, 1);
    }
    expectPageNumbers(pa);
    expectPageNumbers(pb);
  }, 30_000);
});

describe('word layouts shared between worksheets', () => {
  it('prints a plan the same whatever was printed before it in the process', async () => {
    const small = bigSnapshot(40);
    const printedAt = new Date('2026-03-01T10:00:00Z');
    const first = await readPdf(
      await worksheetBuffer({ snapshot: small, meta: meta({ printedAt }) }),
    );
    // Another plan in between fills the shared layouts with its own words, in every face.
    await worksheetBuffer({ snapshot: bigSnapshot(120), meta: meta({ printedAt }) });
    const again = await readPdf(
      await worksheetBuffer({ snapshot: small, meta: meta({ printedAt }) }),
    );
    expect(again.map((p) => p.text)).toEqual(first.map((p) => p.text));
  });
});
