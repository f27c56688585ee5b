/** The grid's filters: by connector, disposition, signal class and free text. */
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { SignalClass } from '#shared/domain/signal-classes.ts';
import type { PinRow } from './rows.ts';

export interface PinFilter {
  connectorId: number | null;
  disposition: Disposition | null;
  signalClass: SignalClass | null;
  /** Matched, ignoring case, against cavity, name, function, colour, destination and notes. */
  text: string;
}

export const NO_FILTER: PinFilter = {
  connectorId: null,
  disposition: null,
  signalClass: null,
  text: '',
};

export function isFiltering(filter: PinFilter): boolean {
  return (
    filter.connectorId !== null ||
    filter.disposition !== null ||
    filter.signalClass !== null ||
    filter.text.trim() !== ''
  );
}

function matchesText(row: PinRow, needle: string): boolean {
  const { pin } = row;
  return [
    pin.cavity,
    row.name,
    pin.function,
    pin.colour,
    pin.destination,
    row.linkedDestination,
    pin.notes,
  ].some((field) => field.toLowerCase().includes(needle));
}

/** Which filter clauses hide this row (empty when it shows). */
function clausesHiding(row: PinRow, filter: PinFilter): Array<keyof PinFilter> {
  const hiding: Array<keyof PinFilter> = [];
  if (filter.connectorId !== null && row.pin.connectorId !== filter.connectorId)
    hiding.push('connectorId');
  if (filter.disposition !== null && row.pin.disposition !== filter.disposition)
    hiding.push('disposition');
  if (filter.signalClass !== null && row.pin.signalClass !== filter.signalClass)
    hiding.push('signalClass');
  const needle = filter.text.trim().toLowerCase();
  if (needle && !matchesText(row, needle)) hiding.push('text');
  return hiding;
}

export function filterRows(rows: readonly PinRow[], filter: PinFilter): PinRow[] {
  if (!isFiltering(filter)) return [...rows];
  return rows.filter((row) => clausesHiding(row, filter).length === 0);
}

/** The filter with the clauses that hide this row taken off, so the row can be shown. */
export function revealRow(row: PinRow, filter: PinFilter): PinFilter {
  const hiding = clausesHiding(row, filter);
  if (hiding.length === 0) return filter;
  const next = { ...filter };
  for (const clause of hiding) {
    if (clause === 'text') next.text = '';
    else next[clause] = null;
  }
  return next;
}
