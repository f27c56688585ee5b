/** What to get ready before the work: the wire cut list with the parts count, and the fuses and relays. */
import {
  DEFAULT_FUSE_TYPE,
  FUSE_FAMILIES,
  fuseColour,
  isStandardFuseRating,
} from '#shared/domain/electrical/fuses.ts';
import { describeWireColour, parseWireColour } from '#shared/domain/wire-colours.ts';
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import type { Finding } from '#shared/schemas/checks.schema.ts';
import {
  DROP_CLASS_LABELS,
  FEED_SOURCE_LABELS,
  WIRE_ZONE_LABELS,
} from '#shared/schemas/feeds.schema.ts';
import type { SnapshotFeed } from '#shared/schemas/snapshot.schema.ts';
import { CUT_LIST_RULES, formatMetres, type CutList } from '../cut-list.ts';
import { pinName, type PlanIndex } from '../plan.ts';
import type { Sheet } from '../sheet.ts';
import { drawPlainTable } from '../plain-table.ts';
import { drawTable, type Row } from '../table.ts';
import { BODY, bullet, flow, heading, SMALL, swatchLead } from './common.ts';

export const CUT_LIST_TITLE = 'Wire cut list and parts';
export const FUSES_TITLE = 'Fuse and relay schedule';

const MAX_PARTS_LISTED = 30;

function partsText(parts: CutList['rows'][number]['parts']): string {
  const listed = parts
    .slice(0, MAX_PARTS_LISTED)
    .map((p) => `${p.label} ${formatMetres(p.lengthM)}`)
    .join(' · ');
  return parts.length > MAX_PARTS_LISTED
    ? `${listed} · and ${parts.length - MAX_PARTS_LISTED} more`
    : listed;
}

/** "BU blue · WH white …" for the codes that appear, so the sheet reads without a chart. */
function colourLegend(colours: string[]): string {
  const codes = new Set<string>();
  for (const c of colours) {
    const parsed = c ? parseWireColour(c) : null;
    if (!parsed?.ok) continue;
    codes.add(parsed.colour.base);
    if (parsed.colour.stripe) codes.add(parsed.colour.stripe);
  }
  return [...codes]
    .sort()
    .map((code) => `${code} ${describeWireColour(code)}`)
    .join(' · ');
}

export async function drawCutList(sheet: Sheet, index: PlanIndex, cut: CutList): Promise<void> {
  const unit = sheet.meta.sizeUnit;
  sheet.addPage();
  sheet.section(CUT_LIST_TITLE);
  heading(
    sheet,
    CUT_LIST_TITLE,
    `New wire by size and colour, with a ${cut.allowancePct} % service allowance added to every length. Lengths in metres.`,
  );
  const rows: Row[] = cut.rows.map((r) => ({
    cells: [
      { text: r.sizeMm2 == null ? 'not recorded' : formatWireSize(r.sizeMm2, unit) },
      {
        text: r.colour || 'not set',
        lead: swatchLead(r.colour),
        style: { face: 'mono', size: 8 },
      },
      { text: String(r.pieces), align: 'right' },
      { text: formatMetres(r.lengthM), align: 'right', style: { face: 'mono' } },
      { text: formatMetres(r.cutM), align: 'right', style: { face: 'monoBold' } },
      { text: partsText(r.parts), style: { size: 7.5 } },
    ],
  }));
  rows.push({
    shade: true,
    cells: [
      { text: 'Total', style: { face: 'bold' } },
      { text: '' },
      { text: String(cut.rows.reduce((s, r) => s + r.pieces, 0)), align: 'right' },
      { text: formatMetres(cut.totalLengthM), align: 'right', style: { face: 'monoBold' } },
      { text: formatMetres(cut.totalCutM), align: 'right', style: { face: 'monoBold' } },
      {
        text: `Total new wire: ${formatMetres(cut.totalLengthM)} m + ${cut.allowancePct} % = ${formatMetres(cut.totalCutM)} m`,
        style: { face: 'semibold', size: 7.5 },
      },
    ],
  });
  await drawTable(sheet, {
    continued: CUT_LIST_TITLE,
    columns: [
      { title: 'Size', width: 58 },
      { title: 'Colour', width: 66 },
      { title: 'Pieces', width: 38, align: 'right' },
      { title: 'Length m', width: 50, align: 'right' },
      { title: `Cut m (+${cut.allowancePct} %)`, width: 62, align: 'right' },
      { title: 'Made up of', flex: 1 },
    ],
    rows,
    minRowHeight: 17,
  });

  sheet.y += 10;
  const { parts } = cut;
  drawPlainTable(sheet, {
    columns: [
      { title: 'Parts to have ready' },
      { title: 'Count', width: 50, align: 'right', face: 'monoBold' },
    ],
    rows: [
      ['Splices (sealed butt or multi-wire)', parts.splices],
      ['Terminals (cavity, ring or blade, to suit each end)', parts.terminals],
      ['End caps or heat-shrink for cut-and-insulated wires', parts.endCaps],
      ['Seal plugs for de-pinned cavities (sealed housings)', parts.sealPlugs],
    ].map(([label, count]) => [String(label), String(count)]),
    rowHeight: 16,
  });

  sheet.y += 8;
  if (cut.unmeasured.length) {
    const names = cut.unmeasured.map((p) => pinName(index, p)).join(', ');
    heading(sheet, 'Lengths to measure', undefined, 30);
    flow(
      sheet,
      `${cut.unmeasured.length} extended or joined pin${cut.unmeasured.length === 1 ? ' has' : 's have'} no run length in the plan and ${cut.unmeasured.length === 1 ? 'is' : 'are'} not in the totals above. Measure each route at the vehicle, add the allowance, and cut to suit: ${names}.`,
    );
    sheet.y += 6;
  }
  const legend = colourLegend([
    ...cut.rows.map((r) => r.colour),
    ...index.snapshot.pins.map((p) => p.colour),
  ]);
  sheet.ensure(40);
  sheet.y += 4;
  flow(sheet, 'How this list is counted', { ...SMALL, face: 'semibold' });
  for (const rule of CUT_LIST_RULES) bullet(sheet, rule, SMALL, 2);
  if (legend) {
    sheet.y += 3;
    flow(sheet, `Colour codes (IEC 60757; base colour, then stripe): ${legend}.`, SMALL);
  }
}

function fuseText(feed: SnapshotFeed): string {
  if (feed.fuseA == null) {
    return feed.source === 'relay_output' ? 'none (fused upstream)' : 'NO FUSE';
  }
  const type = feed.fuseType ?? DEFAULT_FUSE_TYPE;
  const family = FUSE_FAMILIES[type];
  const colour = fuseColour(feed.fuseA, type);
  return [
    type === DEFAULT_FUSE_TYPE ? null : family.label.toLowerCase(),
    colour ??
      (isStandardFuseRating(feed.fuseA, type)
        ? null
        : `not a ${family.label.toLowerCase()} rating`),
    feed.unfusedLengthMm != null
      ? `${feed.unfusedLengthMm} mm from source${feed.fuseSheathed ? ', sheathed' : ''}`
      : 'fit within 178 mm of source',
  ]
    .filter(Boolean)
    .join('\n');
}

function checkText(own: Finding[]): string {
  if (own.length === 0) return 'OK: no findings';
  return own.map((f) => `${f.severity.toUpperCase()}: ${f.title}`).join('\n');
}

export async function drawFuseSchedule(sheet: Sheet, index: PlanIndex): Promise<void> {
  const unit = sheet.meta.sizeUnit;
  sheet.y += 14;
  sheet.ensure(140);
  sheet.section(FUSES_TITLE);
  heading(
    sheet,
    FUSES_TITLE,
    'Each new feed: its fuse (fitted near the source), relay, wire and loads, with what the checks found.',
  );
  const rows: Row[] = index.snapshot.feeds.map((feed) => {
    const source =
      feed.source === 'relay_output'
        ? `Relay output of ${index.feeds.get(feed.sourceFeedId ?? -1)?.name ?? 'another feed'}`
        : FEED_SOURCE_LABELS[feed.source];
    const relay = feed.relay
      ? [
          `Contacts ${feed.relay.contactRatingA} A`,
          feed.relay.coilResistanceOhm != null
            ? `Coil ${feed.relay.coilResistanceOhm} Ω`
            : `Coil ${feed.relay.coilCurrentA} A`,
          feed.relay.coilPinId != null
            ? `Coil driven by ${pinName(index, feed.relay.coilPinId)}`
            : '',
        ]
          .filter(Boolean)
          .join('\n')
      : 'none';
    const wire = [
      `${feed.wire.colour || 'colour not set'} ${formatWireSize(feed.wire.sizeMm2, unit)}`,
      `${formatMetres(feed.wire.lengthM)} m, ${WIRE_ZONE_LABELS[feed.wire.zone].toLowerCase()}`,
      feed.wire.returnPath === 'wire' ? 'own return wire' : 'chassis return',
      feed.wire.colour ? describeWireColour(feed.wire.colour) : '',
    ]
      .filter(Boolean)
      .join('\n');
    const loads = feed.loads.length
      ? feed.loads
          .map(
            (l) =>
              `${l.pinId != null ? `${pinName(index, l.pinId)} ` : ''}${l.name || 'load'}: ${l.currentA} A${l.continuous ? ' continuous' : ''}${l.kind && l.kind !== 'resistive' ? `, ${l.kind}` : ''}`,
          )
          .join('\n')
      : 'no loads recorded';
    const own = sheet.meta.findings.filter((f) => f.subject.feedId === feed.id);
    const bad = own.some((f) => f.severity === 'error');
    return {
      cells: [
        {
          title: feed.name,
          text: `${source}\n${DROP_CLASS_LABELS[feed.dropClass].split(':')[0]} drop class${feed.notes ? `\n${feed.notes}` : ''}`,
        },
        feed.fuseA == null
          ? { text: fuseText(feed), style: { face: 'bold' } }
          : { title: `${feed.fuseA} A`, text: fuseText(feed) },
        { text: relay },
        { text: wire, lead: swatchLead(feed.wire.colour), style: { size: 8 } },
        { text: loads, style: { size: 8 } },
        { text: checkText(own), style: bad ? { face: 'bold', size: 8 } : { size: 8 } },
      ],
    };
  });
  if (rows.length === 0) {
    flow(sheet, 'This plan has no new fused feeds.', BODY);
    return;
  }
  await drawTable(sheet, {
    continued: FUSES_TITLE,
    columns: [
      { title: 'Feed', flex: 1.25 },
      { title: 'Fuse', width: 54 },
      { title: 'Relay', width: 74 },
      { title: 'Wire', flex: 1.1 },
      { title: 'Loads', flex: 1.3 },
      { title: 'Check', flex: 1 },
    ],
    rows,
    minRowHeight: 20,
  });
}
