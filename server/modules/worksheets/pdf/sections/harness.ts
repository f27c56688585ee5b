/**
 * The harness on paper: the wire list with both ends, the splices, the ground points, the relay
 * and fuse box, and one circuit drawing per feed (the same layout the screen draws as SVG).
 */
import { HarnessGraph } from '#shared/domain/harness/circuit-graph.ts';
import {
  DIAGRAM_FONT_PX,
  layoutCircuit,
  type CircuitLayout,
} from '#shared/domain/harness/circuit-layout.ts';
import { FUSE_FAMILIES, fuseColour } from '#shared/domain/electrical/fuses.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import { GROUND_LOCATION_LABELS } from '#shared/schemas/harness.schema.ts';
import type { PlanIndex } from '../plan.ts';
import type { Sheet } from '../sheet.ts';
import { drawTable, type Row } from '../table.ts';
import { baselineOf, INK } from '../text.ts';
import { BODY, flow, heading } from './common.ts';

export const WIRES_TITLE = 'Wire list';
export const CIRCUITS_TITLE = 'Circuit drawings';

function graphOf(sheet: Sheet, index: PlanIndex): HarnessGraph | null {
  const harness = index.snapshot.harness;
  return harness ? new HarnessGraph(index.snapshot, harness, sheet.meta.sizeUnit) : null;
}

export async function drawHarness(sheet: Sheet, index: PlanIndex): Promise<void> {
  const graph = graphOf(sheet, index);
  sheet.y += 14;
  sheet.ensure(140);
  sheet.section(WIRES_TITLE);
  heading(
    sheet,
    WIRES_TITLE,
    'Every wire of the new harness with both ends. Label each wire near both ends with its id.',
  );
  if (!graph || graph.harness.wires.length === 0) {
    flow(sheet, 'This plan has no wires yet.', BODY);
    return;
  }
  const h = graph.harness;
  const unit = sheet.meta.sizeUnit;
  const endText = (wireId: number, i: number) => {
    const w = h.wires.find((x) => x.id === wireId)!;
    const end = w.ends[i]!;
    const node = graph.describe(
      end.kind === 'unresolved' ? `unresolved:${w.id}:${i}` : nodeIdOf(end),
    );
    const terminal = end.kind === 'relay' || end.kind === 'fuse' ? ` terminal ${end.terminal}` : '';
    return `${node.title}${terminal}${node.lines[0] ? `\n${node.lines[0]}` : ''}`;
  };
  const wireRows: Row[] = h.wires.map((w) => ({
    cells: [
      { text: w.label, style: { face: 'bold' } },
      { text: w.colour || 'not set' },
      { text: w.sizeMm2 == null ? 'not set' : formatWireSize(w.sizeMm2, unit) },
      { text: w.lengthM == null ? 'measure' : `${w.lengthM} m` },
      {
        text: [w.twistGroup ? `twist ${w.twistGroup}` : '', w.shielded ? 'shielded' : '']
          .filter(Boolean)
          .join(', '),
        style: { size: 8 },
      },
      { text: endText(w.id, 0), style: { size: 8 } },
      { text: endText(w.id, 1), style: { size: 8 } },
    ],
  }));
  await drawTable(sheet, {
    continued: WIRES_TITLE,
    columns: [
      { title: 'Wire', width: 44 },
      { title: 'Colour', width: 50 },
      { title: 'Size', width: 52 },
      { title: 'Length', width: 44 },
      { title: 'Run', width: 50 },
      { title: 'End A', flex: 1 },
      { title: 'End B', flex: 1 },
    ],
    rows: wireRows,
    minRowHeight: 18,
  });

  if (h.splices.length) {
    sheet.y += 10;
    heading(sheet, 'Splices', 'Each splice, where it sits and the wires it joins.', 60);
    await drawTable(sheet, {
      continued: 'Splices',
      columns: [
        { title: 'Splice', width: 50 },
        { title: 'Where', flex: 1 },
        { title: 'Wires', flex: 1.4 },
        { title: 'Sealed', width: 44 },
      ],
      rows: h.splices.map((s) => ({
        cells: [
          { text: s.label, style: { face: 'bold' } },
          {
            text: [s.branch, s.distanceMm != null ? `${s.distanceMm} mm from datum` : '', s.notes]
              .filter(Boolean)
              .join('\n'),
          },
          {
            text: h.wires
              .filter((w) => w.ends.some((e) => e.kind === 'splice' && e.refId === s.id))
              .map((w) => w.label)
              .join(', '),
          },
          { text: s.sealed ? 'yes' : 'no' },
        ],
      })),
      minRowHeight: 18,
    });
  }

  if (h.groundPoints.length) {
    sheet.y += 10;
    heading(
      sheet,
      'Ground points',
      'Clean to bare metal, fasten to the torque of the stud, protect against corrosion.',
      60,
    );
    await drawTable(sheet, {
      continued: 'Ground points',
      columns: [
        { title: 'Point', width: 50 },
        { title: 'Location', width: 80 },
        { title: 'Strap', width: 54 },
        { title: 'Wires', flex: 1 },
        { title: 'Notes', flex: 1 },
      ],
      rows: h.groundPoints.map((g) => ({
        cells: [
          { text: g.label, style: { face: 'bold' } },
          { text: GROUND_LOCATION_LABELS[g.location] },
          { text: g.strapSizeMm2 == null ? '' : formatWireSize(g.strapSizeMm2, unit) },
          {
            text: h.wires
              .filter((w) => w.ends.some((e) => e.kind === 'ground' && e.refId === g.id))
              .map((w) => w.label)
              .join(', '),
          },
          { text: g.notes },
        ],
      })),
      minRowHeight: 18,
    });
  }

  for (const box of h.boxes) {
    sheet.y += 10;
    heading(sheet, `Box: ${box.label}`, 'Each position, what is fitted and what it serves.', 60);
    const feedName = new Map(index.snapshot.feeds.map((f) => [f.id, f.name]));
    await drawTable(sheet, {
      continued: `Box: ${box.label}`,
      columns: [
        { title: 'Position', width: 50 },
        { title: 'Fitted', flex: 1 },
        { title: 'Serves', flex: 1 },
        { title: 'Terminals wired', flex: 1.2 },
      ],
      rows: box.positions.map((p) => ({
        cells: [
          { text: p.label, style: { face: 'bold' } },
          {
            text:
              p.kind === 'fuse'
                ? `${FUSE_FAMILIES[p.fuseType].label} ${p.ratingA} A${fuseColour(p.ratingA, p.fuseType) ? ` (${fuseColour(p.ratingA, p.fuseType)})` : ''}`
                : `Relay, contacts ${p.contactRatingA} A${p.coilResistanceOhm ? `, coil ${p.coilResistanceOhm} Ω` : ''}`,
          },
          { text: p.feedId != null ? (feedName.get(p.feedId) ?? '') : '' },
          {
            text: h.wires
              .flatMap((w) =>
                w.ends
                  .filter((e) => (e.kind === 'relay' || e.kind === 'fuse') && e.refId === p.id)
                  .map((e) => `${'terminal' in e ? e.terminal : ''}: ${w.label}`),
              )
              .join('\n'),
          },
        ],
      })),
      minRowHeight: 18,
    });
  }

  sheet.y += 14;
  sheet.ensure(160);
  sheet.section(CIRCUITS_TITLE);
  heading(
    sheet,
    CIRCUITS_TITLE,
    'One drawing per new feed: source, fuse, relay contacts (30 → 87) and coil (85/86), wires by id, loads and ground.',
  );
  for (const feed of index.snapshot.feeds) {
    const circuit = graph.feedCircuit(feed.id);
    if (!circuit || circuit.nodes.length === 0) continue;
    drawLayout(sheet, layoutCircuit(circuit));
    await sheet.pause();
  }
}

function nodeIdOf(end: { kind: string; refId?: number; source?: string }): string {
  return end.kind === 'source' ? `source:${end.source}` : `${end.kind}:${end.refId}`;
}

/** The layout drawn with pdfkit, scaled to the page width when wider. */
function drawLayout(sheet: Sheet, layout: CircuitLayout): void {
  const scale = Math.min(1, sheet.contentWidth / layout.width, 0.75);
  const height = layout.height * scale + 22;
  sheet.ensure(height);
  const doc = sheet.doc;
  const x0 = sheet.left;
  const y0 = sheet.y + 16;
  sheet.text.drawLine(
    sheet.text.wrap(layout.title, { face: 'bold', size: 9 }, sheet.contentWidth)[0]!,
    x0,
    baselineOf(sheet.y, { face: 'bold', size: 9 }),
    { face: 'bold', size: 9 },
    sheet.contentWidth,
  );
  const font = DIAGRAM_FONT_PX * scale;
  doc.save();
  doc.strokeColor(INK).fillColor(INK);
  for (const e of layout.edges) {
    const [first, ...rest] = e.points;
    if (!first) continue;
    doc.moveTo(x0 + first.x * scale, y0 + first.y * scale);
    for (const p of rest) doc.lineTo(x0 + p.x * scale, y0 + p.y * scale);
    doc.lineWidth(0.8).stroke();
    const label = e.label;
    doc.font('regular').fontSize(font * 0.9);
    const w = doc.widthOfString(label);
    doc
      .rect(x0 + e.labelAt.x * scale - w / 2 - 1, y0 + e.labelAt.y * scale - font, w + 2, font)
      .fill('#ffffff');
    doc
      .fillColor(INK)
      .text(label, x0 + e.labelAt.x * scale - w / 2, y0 + e.labelAt.y * scale - font, {
        lineBreak: false,
      });
  }
  for (const n of layout.nodes) {
    const x = x0 + (n.x - n.width / 2) * scale;
    const y = y0 + (n.y - n.height / 2) * scale;
    const w = n.width * scale;
    const h = n.height * scale;
    doc.rect(x, y, w, h).fill('#ffffff');
    if (n.kind === 'relay') doc.dash(3, { space: 2 });
    if (n.kind === 'unresolved') doc.dash(1, { space: 1.5 });
    doc
      .roundedRect(x, y, w, h, n.kind === 'splice' ? h / 2 : 2)
      .lineWidth(n.kind === 'source' ? 1.6 : 0.8)
      .stroke();
    doc.undash();
    if (n.kind === 'fuse')
      doc
        .rect(x + 2, y + 2, w - 4, h - 4)
        .lineWidth(0.5)
        .stroke();
    if (n.kind === 'ground') {
      const cx = x + w / 2;
      doc
        .moveTo(cx - 9, y + h + 3)
        .lineTo(cx + 9, y + h + 3)
        .moveTo(cx - 6, y + h + 5.5)
        .lineTo(cx + 6, y + h + 5.5)
        .moveTo(cx - 3, y + h + 8)
        .lineTo(cx + 3, y + h + 8)
        .lineWidth(0.8)
        .stroke();
    }
    [n.title, ...n.lines].forEach((line, i) => {
      doc.font(i === 0 ? 'bold' : 'regular').fontSize(font);
      doc.fillColor(INK).text(line, x, y + 4 * scale + i * font * 1.3, {
        width: w,
        align: 'center',
        lineBreak: false,
        ellipsis: true,
      });
    });
  }
  doc.restore();
  sheet.y = y0 + layout.height * scale + 10;
}
