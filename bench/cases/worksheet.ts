/**
 * The bench worksheet of a 300-pin conversion: generation time, peak heap and the longest stretch
 * the event loop was held, beside pdfkit writing the same rows as plain text lines in the same run.
 */
import PDFDocument from 'pdfkit';
import { DISPOSITION_INFO, type Disposition } from '../../shared/domain/dispositions.ts';
import { formatWireSize } from '../../shared/domain/wire-sizes.ts';
import { BLANK_PIN_VALUES } from '../../shared/schemas/pin-map.schema.ts';
import type { ConversionSnapshot, SnapshotPin } from '../../shared/schemas/snapshot.schema.ts';
import { registerFonts } from '../../server/modules/worksheets/pdf/fonts.ts';
import type { WorksheetMeta } from '../../server/modules/worksheets/pdf/meta.ts';
import { worksheetBuffer } from '../../server/modules/worksheets/pdf/render.ts';
import { measure, type BenchRow } from '../lib/report.ts';

const PINS = 300;
const RUNS = 5;
const MIX: Disposition[] = ['keep', 'keep', 'keep', 'join', 'extend', 'depin', 'cut', 'empty'];

/** Three 100-cavity connectors, every pin filled in, dispositions mixed, one feed. */
function snapshot300(): ConversionSnapshot {
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
        function: `Generated circuit ${c + 1}.${i + 1} to the bench test point`,
        signalClass: 'sensor_signal',
        colour: 'BU/WH',
        sizeMm2: 0.5,
        insulationRatingC: 105,
        disposition,
        destination: disposition === 'join' ? `Bench test point ${i}` : '',
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
        wire: {
          sizeMm2: 1.5,
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

const meta: WorksheetMeta = {
  workshopName: 'Harrow Lane Engine Works',
  paperSize: 'A4',
  sizeUnit: 'mm2',
  serviceAllowancePct: 15,
  printedAt: new Date(),
  revision: null,
  findings: [],
};

/** The baseline: one plain text line per pin, wrapped and paginated by pdfkit itself. */
function plainLines(snapshot: ConversionSnapshot): Promise<Buffer> {
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

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export async function worksheetBench(): Promise<BenchRow[]> {
  const snapshot = snapshot300();
  const name = `Worksheet PDF, ${PINS} pins`;
  // The first print in a process also parses the fonts and warms the JIT: shown on its own.
  const cold = await run(() => worksheetBuffer({ snapshot, meta }));
  const warm = [];
  const plain = [];
  for (let i = 0; i < RUNS; i++) {
    warm.push(await run(() => worksheetBuffer({ snapshot, meta })));
    plain.push(await run(() => plainLines(snapshot)));
  }
  const summary = (runs: Array<Awaited<ReturnType<typeof run>>>) => ({
    'ms (median)': median(runs.map((r) => r.ms)),
    'peak heap MB': Math.max(...runs.map((r) => r.peakHeapMb)),
    'max loop block ms': Math.max(...runs.map((r) => r.maxBlockMs)),
    'KB out': median(runs.map((r) => r.bytes)) / 1024,
  });
  const worksheet = summary(warm);
  const baseline = summary(plain);
  return [
    {
      case: name,
      subject: 'Loomwright, first in process',
      figures: {
        'ms (median)': cold.ms,
        'peak heap MB': cold.peakHeapMb,
        'max loop block ms': cold.maxBlockMs,
        'KB out': cold.bytes / 1024,
      },
    },
    { case: name, subject: `Loomwright, ${RUNS} runs`, figures: worksheet },
    { case: name, subject: 'pdfkit, same rows as text lines', figures: baseline },
    {
      case: name,
      subject: 'ratio Loomwright/plain',
      figures: { 'ms (median)': worksheet['ms (median)'] / baseline['ms (median)'] },
    },
  ];
}
