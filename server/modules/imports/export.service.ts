import { csvRecord, UTF8_BOM } from '#shared/domain/csv.ts';
import { cavityName } from '#shared/domain/pin-names.ts';
import { exactAwg, formatAwgGauge } from '#shared/domain/wire-sizes.ts';
import { IMPORT_FIELDS, type ImportField } from '#shared/schemas/imports.schema.ts';
import { Connector, Feed, Pin } from '../../db/models/index.ts';
import type { Actor } from '../../lib/actor.ts';
import { findConversionInWorkshop } from '../conversions/conversions.service.ts';
import { PIN_ORDER } from '../pin-map/pins.service.ts';

type Cell = string | number | null;

/** The columns of a blank pinout file: everything but `connector`, which only a whole conversion needs. */
export const TEMPLATE_FIELDS: readonly ImportField[] = IMPORT_FIELDS.filter(
  (f) => f !== 'connector',
);

interface ExportPin {
  cavity: string;
  function: string;
  signalClass: string;
  colour: string;
  sizeMm2: number | null;
  insulationRatingC: number | null;
  disposition: string;
  destination: string;
  feed: string;
  runLengthM: number | null;
  loadCurrentA: number | null;
  notes: string;
}

/** One pin as a row of cells in IMPORT_FIELDS order; the size also in AWG when it is one exactly. */
function pinCells(connector: string | null, pin: ExportPin): Record<ImportField, Cell> {
  const awg = pin.sizeMm2 == null ? null : exactAwg(pin.sizeMm2);
  return {
    connector,
    cavity: pin.cavity,
    function: pin.function,
    signal_class: pin.signalClass,
    colour: pin.colour,
    size_mm2: pin.sizeMm2,
    awg: awg === null ? null : formatAwgGauge(awg),
    insulation_c: pin.insulationRatingC,
    disposition: pin.disposition,
    destination: pin.destination,
    feed: pin.feed,
    run_length_m: pin.runLengthM,
    load_current_a: pin.loadCurrentA,
    notes: pin.notes,
  };
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
    const cells = pinCells(labels.get(pin.connectorId) ?? '', {
      ...pin,
      destination: target
        ? cavityName(labels.get(target.connectorId) ?? '', target.cavity)
        : pin.destination,
      feed: pin.destinationFeedId == null ? '' : (feedNames.get(pin.destinationFeedId) ?? ''),
    });
    body += csvRecord(IMPORT_FIELDS.map((f) => cells[f]));
  }
  return { fileName: `${safeFileName(conversion.name)}-pins.csv`, body };
}

/** The blank pinout file: the headers and one example row (an invented pin of the demo's E2). */
export function templateCsv(): string {
  const example = pinCells(null, {
    cavity: '2',
    function: 'ECU main feed 1 (from main relay)',
    signalClass: 'power_feed',
    colour: 'RD',
    sizeMm2: 1.5,
    insulationRatingC: 105,
    disposition: 'join',
    destination: '',
    feed: 'ECU main',
    runLengthM: 1.5,
    loadCurrentA: 5,
    notes: 'Example row: replace it with your pinout.',
  });
  return UTF8_BOM + csvRecord(TEMPLATE_FIELDS) + csvRecord(TEMPLATE_FIELDS.map((f) => example[f]));
}
