/** The bench work as lists in the order it is done: de-pin, cut and insulate, extend, join. */
import { DISPOSITION_INFO } from '#shared/domain/dispositions.ts';
import type { SnapshotPin } from '#shared/schemas/snapshot.schema.ts';
import { formatMetres } from '../cut-list.ts';
import {
  ACTION_STEPS,
  actionLists,
  destinationOf,
  pinName,
  type ActionStep,
  type PlanIndex,
} from '../plan.ts';
import type { Sheet } from '../sheet.ts';
import { drawTable, type Column, type Row } from '../table.ts';
import { BODY, flow, heading, tickCell, wireCell } from './common.ts';

export const ACTIONS_TITLE = 'Work in this order';

const INSTRUCTIONS: Record<ActionStep | 'undecided', string> = {
  depin:
    'Release each terminal with the proper tool and draw the wire out of the back of the housing. Fit a seal plug in the empty cavity of a sealed housing.',
  cut: 'Cut the wire back and seal its end with an adhesive-lined end cap or heat-shrink. The terminal stays in its cavity.',
  extend:
    'Lengthen or reroute the wire in the same size and colour, with sealed splices; support it along the new route.',
  join: 'Run each wire to its destination in the size and colour shown. A wire that joins a feed connects on the load side of that feed’s fuse.',
  undecided: 'The plan has not decided these pins yet. Leave them as they are until it does.',
};

/** Where a pin goes, with what is there: "V1-3 Tachometer signal", "Feed: ECU main, 15 A fuse". */
function destinationText(index: PlanIndex, pin: SnapshotPin): string {
  const dest = destinationOf(index, pin);
  if (dest.kind === 'pin') {
    const target = index.pins.get(pin.destinationPinId!);
    return target?.function ? `${dest.text} ${target.function}` : dest.text;
  }
  if (dest.kind === 'feed') {
    const feed = index.feeds.get(pin.destinationFeedId!);
    return feed?.fuseA != null ? `${dest.text}, ${feed.fuseA} A fuse` : dest.text;
  }
  return dest.text || 'not recorded';
}

export async function drawActions(sheet: Sheet, index: PlanIndex): Promise<void> {
  const lists = actionLists(index);
  const unit = sheet.meta.sizeUnit;
  sheet.addPage();
  sheet.section(ACTIONS_TITLE);
  heading(
    sheet,
    ACTIONS_TITLE,
    'Battery disconnected. Tick each pin as it is done; record the tests in the connector tables that follow.',
    40,
  );
  const steps = [...ACTION_STEPS, 'undecided'] as const;
  let number = 0;
  for (const step of steps) {
    const pins = lists[step];
    if (step === 'undecided' && pins.length === 0) continue;
    number += 1;
    const title =
      step === 'undecided'
        ? `Not decided (${pins.length})`
        : `${number}. ${DISPOSITION_INFO[step].label} (${pins.length})`;
    sheet.y += 6;
    if (pins.length === 0) {
      heading(sheet, title, undefined, 14);
      flow(sheet, 'Nothing to do in this step.', BODY);
      continue;
    }
    heading(sheet, title, INSTRUCTIONS[step]);
    const withRoute = step === 'extend' || step === 'join';
    const tick = step !== 'undecided';
    const columns: Column[] = [
      ...(tick ? [{ title: 'Done', width: 28, align: 'center' as const }] : []),
      { title: 'Pin', width: 44 },
      { title: 'Function', flex: 1.3 },
      { title: 'Wire', width: 98 },
      ...(withRoute
        ? [
            { title: 'Run', width: 44, align: 'right' as const },
            { title: 'Destination', flex: 1.2 },
          ]
        : [{ title: 'Notes', flex: 1 }]),
    ];
    const rows: Row[] = pins.map((pin) => ({
      cells: [
        ...(tick ? [tickCell()] : []),
        { text: pinName(index, pin), style: { face: 'monoBold', size: 8.5 } },
        { text: pin.function || '(no function recorded)' },
        wireCell(pin.colour, pin.sizeMm2, unit),
        ...(withRoute
          ? [
              {
                text:
                  pin.runLengthM != null && pin.runLengthM > 0
                    ? `${formatMetres(pin.runLengthM)} m`
                    : 'measure',
                align: 'right' as const,
                style: { face: 'mono' as const, size: 8 },
              },
              { text: destinationText(index, pin) },
            ]
          : [{ text: pin.notes, style: { size: 8 } }]),
      ],
    }));
    await drawTable(sheet, {
      continued: title,
      columns,
      rows,
      zebra: true,
      minRowHeight: 18,
    });
  }
}
