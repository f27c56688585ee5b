import { csvRecord, UTF8_BOM } from '#shared/domain/csv.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import { csvColumns, type FieldSpec } from '#shared/domain/fields/field-table.ts';
import { PIN_FIELDS } from '#shared/domain/fields/pin-fields.ts';
import { IMPORT_FIELDS, type ImportField } from '#shared/schemas/imports.schema.ts';
import { BLANK_PIN_VALUES, type PinFields } from '#shared/schemas/pin-map.schema.ts';
import { Connector, Feed, Pin } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { PIN_ORDER } from '../pin-map/pins.service.ts';

type Cell = string | number | null;

/** The columns of a blank pinout file: everything but `connector`, which only a whole conversion needs. */
export const TEMPLATE_FIELDS: readonly ImportField[] = IMPORT_FIELDS.filter(
  (f) => f !== 'connector',
);

const PIN_CSV_COLUMNS = csvColumns(PIN_FIELDS);

/**
 * One pin as a row of cells in IMPORT_FIELDS order, each column written as the pin field table
 * says. A link travels by name: `destination` holds the linked cavity's name when there is one.
 */
function pinCells(
  connector: string | null,
  cavity: string,
  pin: PinFields,
  feedName: string,
): Record<ImportField, Cell> {
  const cells: Record<ImportField, Cell> = { connector, cavity };
  for (const { key, column } of PIN_CSV_COLUMNS) {
    const spec = PIN_FIELDS[key] as FieldSpec<unknown>;
    cells[column.header] =
      column.names === 'feed'
        ? feedName
        : column.write
          ? column.write(pin[key])
          : spec.format(pin[key], 'mm2');
  }
  return cells;
}

/** A name safe for Content-Disposition: letters, digits, dot, dash and underscore. */
export function safeFileName(name: string): string {
  const ascii = name
    .normalize('NFKD')
    .replace(/[^\w.-]+/g, '-')
    .replace(/-+/g, '-')
    .replace(/^-|-$/g, '');
  return ascii.slice(0, 80) || 'pins';
}

/**
 * Every pin of a conversion as an RFC 4180 CSV (UTF-8 with a byte-order mark so spreadsheets read
 * it as UTF-8): the import's columns plus `connector`. A link to a vehicle-side cavity is written
 * as its name ("V1-3") and a joined feed by its name, so the file imports back into the same pins.
 */
export async function exportPinsCsv(
  actor: Actor,
  conversionId: number,
): Promise<{ fileName: string; body: string }> {
  const conversion = await findConversionInWorkshop(actor, conversionId);
  const connectors = await Connector.findAll({ where: { conversionId }, raw: true });
  const pins = await Pin.findAll({ where: { conversionId }, order: PIN_ORDER, raw: true });
  const feeds = await Feed.findAll({
    where: { conversionId },
    attributes: ['id', 'name'],
    raw: true,
  });
  const labels = new Map(connectors.map((c) => [c.id, c.label]));
  const byId = new Map(pins.map((p) => [p.id, p]));
  const feedNames = new Map(feeds.map((f) => [f.id, f.name]));

  let body = UTF8_BOM + csvRecord(IMPORT_FIELDS);
  for (const pin of pins) {
    const target = pin.destinationPinId == null ? undefined : byId.get(pin.destinationPinId);
    const cells = pinCells(
      labels.get(pin.connectorId) ?? '',
      pin.cavity,
      {
        ...pin,
        destination: target
          ? cavityName(labels.get(target.connectorId) ?? '', target.cavity)
          : pin.destination,
      },
      pin.destinationFeedId == null ? '' : (feedNames.get(pin.destinationFeedId) ?? ''),
    );
    body += csvRecord(IMPORT_FIELDS.map((f) => cells[f]));
  }
  return { fileName: `${safeFileName(conversion.name)}-pins.csv`, body };
}

/** The blank pinout file: the headers and one example row (an invented pin of the demo's E2). */
export function templateCsv(): string {
  const example = pinCells(
    null,
    '2',
    {
      ...BLANK_PIN_VALUES,
      function: 'ECU main feed 1 (from main relay)',
      signalClass: 'power_feed',
      colour: 'RD',
      sizeMm2: 1.5,
      insulationRatingC: 105,
      disposition: 'join',
      runLengthM: 1.5,
      loadCurrentA: 5,
      notes: 'Example row: replace it with your pinout.',
    },
    'ECU main',
  );
  return UTF8_BOM + csvRecord(TEMPLATE_FIELDS) + csvRecord(TEMPLATE_FIELDS.map((f) => example[f]));
}
