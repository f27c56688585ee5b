/**
 * The bench worksheet of a 300-pin conversion: generation time, peak heap and the longest stretch
 * the event loop was held, beside pdfkit writing the same rows as plain text lines in the same run.
 */
import PDFDocument from 'pdfkit';
import { checkReport } from '../../shared/domain/checks/run-checks.ts';
import type { Finding } from '../../shared/schemas/checks.schema.ts';
import { DISPOSITION_INFO, type Disposition } from '../../shared/domain/dispositions.ts';
import { formatWireSize } from '../../shared/domain/wire-sizes.ts';
import { BLANK_PIN_VALUES } from '../../shared/schemas/pin-map.schema.ts';
import type { ConversionSnapshot, SnapshotPin } from '../../shared/schemas/snapshot.schema.ts';
import { registerFonts } from '../../server/modules/worksheets/pdf/fonts.ts';
import type { WorksheetMeta } from '../../server/modules/worksheets/pdf/meta.ts';
import { worksheetBuffer } from '../../server/modules/worksheets/pdf/render.ts';
import { measure, type BenchRow } from '../lib/report.ts';
import { alternate, num, ratios, spread, times, withUnit } from '../lib/stats.ts';

const PINS = 300;
const ROUNDS = 5;
const MIX: Disposition[] = ['keep', 'keep', 'keep', 'join', 'extend', 'depin', 'cut', 'empty'];

/**
 * Three 100-cavity connectors, every pin filled in, dispositions mixed, one feed. Each `variant`
 * words its circuits and destinations differently, so no round prints what an earlier one did
 * (the product keeps word layouts across worksheets; a reprint of the same plan would flatter it).
 */
function snapshot300(variant = 0): ConversionSnapshot {
  const connectors: ConversionSnapshot['connectors'] = [];
  const pins: SnapshotPin[] = [];
  for (let c = 0; c < PINS / 100; c++) {
    connectors.push({
      id: c + 1,
      conversionId: 1,
      label: `G${c + 1}`,
      side: 'ecu',
      cavityCount: 100,
      rows: 4,
      columns: 25,
      notes: '',
    });
    for (let i = 0; i < 100; i++) {
      const disposition = MIX[i % MIX.length]!;
      pins.push({
        id: pins.length + 1,
        connectorId: c + 1,
        conversionId: 1,
        cavity: String(i + 1),
        position: i,
        ...BLANK_PIN_VALUES,
        function: `Generated circuit ${variant}-${c + 1}.${i + 1} to bench point ${variant * 1000 + i}`,
        signalClass: 'sensor_signal',
        colour: 'BU/WH',
        sizeMm2: 0.5,
        insulationRatingC: 105,
        disposition,
        destination: disposition === 'join' ? `Bench test point ${variant}-${i}` : '',
        runLengthM: disposition === 'join' || disposition === 'extend' ? 1.5 : null,
        loadCurrentA: 0.1,
        notes: i % 10 === 0 ? 'Route along the existing loom; tie every 150 mm.' : '',
      });
    }
  }
  return {
    format: 1,
    conversion: {
      id: 1,
      name: 'Bench conversion',
      donorEngine: 'KT-20 2.0 L turbo I4',
      receivingVehicle: 'Corran 100 flatbed',
      systemVoltage: 12,
      notes: '',
    },
    workshop: { id: 1, name: 'Harrow Lane Engine Works' },
    connectors,
    pins,
    feeds: [
      {
        id: 1,
        conversionId: 1,
        name: 'ECU main',
        source: 'battery',
        sourceFeedId: null,
        fuseA: 15,
        relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: 4 },
        // A thin wire on this fuse, so the worksheet has findings to print with their working.
        wire: {
          sizeMm2: 0.5,
          insulationRatingC: 105,
          lengthM: 1,
          zone: 'engine_bay',
          bundled: 1,
          returnPath: 'wire',
          colour: 'RD',
        },
        loads: [{ id: 1, pinId: null, name: 'ECU', currentA: 10, continuous: true }],
        dropClass: 'critical',
        dropLimitPct: null,
        notes: '',
      },
    ],
  };
}

function metaFor(findings: Finding[]): WorksheetMeta {
  return {
    workshopName: 'Harrow Lane Engine Works',
    paperSize: 'A4',
    sizeUnit: 'mm2',
    serviceAllowancePct: 15,
    printedAt: new Date(),
    revision: null,
    findings,
  };
}

/**
 * The baseline: one plain text line per pin and per line of each finding (title, message,
 * working, source), in the same embedded font, wrapped and paginated by pdfkit itself.
 */
function plainLines(snapshot: ConversionSnapshot, findings: Finding[]): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 36 });
  registerFonts(doc);
  doc.font('regular').fontSize(8.5);
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const labels = new Map(snapshot.connectors.map((c) => [c.id, c.label]));
  for (const p of snapshot.pins) {
    doc.text(
      [
        `${labels.get(p.connectorId)}-${p.cavity}`,
        p.function,
        p.colour,
        formatWireSize(p.sizeMm2, 'mm2'),
        DISPOSITION_INFO[p.disposition].label,
        p.destination,
        p.notes,
      ].join('  '),
    );
  }
  for (const f of findings) {
    for (const line of [f.title, f.message, ...f.working, f.source]) doc.text(line);
  }
  return new Promise((resolve) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.end();
  });
}

const tick = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Time, peak heap, and the longest gap between the beats of a 2 ms timer while `fn` ran: how long
 * the event loop was held at a stretch (other requests wait that long).
 */
async function run(fn: () => Promise<Buffer>) {
  let last = performance.now();
  let maxBlockMs = 0;
  const beat = setInterval(() => {
    const now = performance.now();
    maxBlockMs = Math.max(maxBlockMs, now - last);
    last = now;
  }, 2);
  await tick(10);
  maxBlockMs = 0;
  last = performance.now();
  const { result, ms, peakHeapMb } = await measure(fn);
  await tick(10);
  clearInterval(beat);
  return { bytes: result.length, ms, peakHeapMb, maxBlockMs };
}

/** P3: the worksheet, findings section included, beside the plain-lines baseline, alternating. */
export async function worksheetBench(rounds: number): Promise<BenchRow[]> {
  // One plan per print, the same for the product and the baseline of a round.
  const plans = Array.from({ length: Math.max(rounds, ROUNDS) + 1 }, (_, variant) => {
    const snapshot = snapshot300(variant);
    const { findings } = checkReport(snapshot, { sizeUnit: 'mm2' });
    return { snapshot, findings, meta: metaFor(findings) };
  });
  const { findings } = plans[0]!;
  if (findings.length === 0) throw new Error('the worksheet bench expects findings to print');
  let productPrints = 0;
  let baselinePrints = 0;
  // The product gives up on a layout after 20 s; a bench on a busy machine measures it to the end.
  const product = () => {
    const { snapshot, meta } = plans[productPrints++]!;
    return run(() => worksheetBuffer({ snapshot, meta }, { deadlineMs: 600_000 }));
  };
  const baseline = () => {
    const { snapshot, findings: printed } = plans[baselinePrints++]!;
    return run(() => plainLines(snapshot, printed));
  };
  // The first print in a process also parses the fonts and warms the JIT: shown on its own.
  const cold = await product();
  await baseline();
  const { product: ours, baseline: theirs } = await alternate(
    Math.max(rounds, ROUNDS),
    product,
    baseline,
  );
  const ratio = ratios(
    ours.map((r) => r.ms),
    theirs.map((r) => r.ms),
  );
  const ms = spread(ours.map((r) => r.ms));
  const base = spread(theirs.map((r) => r.ms));
  const block = spread(ours.map((r) => r.maxBlockMs));
  return [
    {
      id: 'P3',
      measure: `${PINS}-pin worksheet with ${findings.length} findings ÷ pdfkit writing the same rows and findings in the same font (ms)`,
      figure: `${times(ratio)} (${num(ms.median)} vs ${num(base.median)} ms; ${num(spread(ours.map((r) => r.bytes)).median / 1024)} KB; longest loop block ${withUnit(block, 'ms')})`,
      goal: '≤ 3×',
      met: ratio.median <= 3,
    },
    {
      id: 'P3',
      measure: 'first worksheet in the bench process (fonts parsed, JIT cold)',
      figure: `${num(cold.ms)} ms (peak heap ${num(cold.peakHeapMb)} MB)`,
      goal: '–',
      met: null,
    },
  ];
}
