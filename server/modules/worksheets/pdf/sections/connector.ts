/** One connector: its face, then every pin in cavity order with the columns filled in at the bench. */
import { formatWireSize } from '#shared/domain/wire-sizes.ts';
import { CONNECTOR_SIDE_LABELS } from '#shared/schemas/pin-map.schema.ts';
import type { SnapshotConnector } from '#shared/schemas/snapshot.schema.ts';
import { drawFace } from '../face.ts';
import { destinationOf, pinName, type PlanIndex } from '../plan.ts';
import { MUTED, type Sheet } from '../sheet.ts';
import { drawTable, type Cell, type Row } from '../table.ts';
import { cleanText } from '../text.ts';
import {
  count,
  dispositionCell,
  flow,
  heading,
  NOTHING,
  readingCell,
  SMALL,
  swatchLead,
  tickCell,
} from './common.ts';

export function connectorTitle(connector: SnapshotConnector): string {
  return `Connector ${connector.label}, ${CONNECTOR_SIDE_LABELS[connector.side] ?? connector.side}`;
}

export async function drawConnector(
  sheet: Sheet,
  index: PlanIndex,
  connector: SnapshotConnector,
): Promise<void> {
  const pins = index.pinsByConnector.get(connector.id) ?? [];
  const unit = sheet.meta.sizeUnit;
  const title = connectorTitle(connector);
  sheet.addPage();
  sheet.section(title);
  heading(
    sheet,
    title,
    `${count(pins.length, 'pin')} of ${connector.cavityCount} cavities, laid out ${connector.rows} × ${connector.columns}.${connector.notes ? ` ${connector.notes}` : ''}`,
    60,
  );
  await drawFace(sheet, connector, pins);
  flow(
    sheet,
    'Drawn as laid out in the plan, cavity order row by row from the top left. Check which side it shows against the numbers moulded on the housing before you release a terminal. Heavy boxes have work to do.',
    SMALL,
  );
  sheet.y += 8;

  const rows: Row[] = [];
  pins.forEach((pin, i) => {
    const shade = i % 2 === 1;
    const empty = pin.disposition === 'empty';
    const notes = cleanText(pin.notes);
    const dest = destinationOf(index, pin);
    const muted = empty ? { color: MUTED } : {};
    const colour: Cell = pin.colour
      ? { text: pin.colour, lead: swatchLead(pin.colour), style: { face: 'mono', size: 7.5 } }
      : { text: '', style: muted };
    rows.push({
      shade,
      ruleBelow: !notes,
      cells: [
        { text: pin.cavity, style: { face: 'monoBold', size: 9 } },
        { text: pin.function, style: muted },
        colour,
        { text: formatWireSize(pin.sizeMm2, unit), style: { size: 8, ...muted } },
        dispositionCell(pin.disposition),
        {
          text: dest.text,
          style: dest.kind === 'pin' ? { face: 'monoBold', size: 8.5 } : { size: 8 },
        },
        empty ? NOTHING : tickCell(),
        empty || pin.disposition === 'depin' ? NOTHING : tickCell(),
        empty || pin.disposition === 'depin' ? NOTHING : readingCell('Ω'),
      ],
    });
    if (notes) {
      // Notes run under the pin's row, from its function to its destination.
      rows.push({
        shade,
        span: { from: 1, to: 5 },
        cells: [
          { text: `${pinName(index, pin)} note: ${notes}`, style: { size: 8, face: 'medium' } },
        ],
      });
    }
  });

  await drawTable(sheet, {
    continued: `${connector.label} pins`,
    columns: [
      { title: 'Cavity', width: 32 },
      { title: 'Function', flex: 1.6 },
      { title: 'Colour', width: 48 },
      { title: 'Size', width: 46 },
      { title: 'Disposition', width: 88 },
      { title: 'Destination', flex: 1 },
      { title: 'Done', width: 26, align: 'center' },
      { title: 'Tested', width: 32, align: 'center' },
      { title: 'Measured Ω', width: 48, align: 'center' },
    ],
    rows,
    minRowHeight: 20,
  });
}
