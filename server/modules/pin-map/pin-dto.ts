import type { Connector as ConnectorDto, Pin as PinDto } from '#shared/schemas/pin-map.schema.ts';
import type { Connector, Pin } from '../../db/models/index.ts';

type PinRow = Pick<Pin, keyof PinDto>;

/** A pin as the API shows it; works on model instances and on raw rows alike. */
export function toPinDto(pin: PinRow): PinDto {
  return {
    id: pin.id,
    connectorId: pin.connectorId,
    conversionId: pin.conversionId,
    cavity: pin.cavity,
    position: pin.position,
    function: pin.function,
    signalClass: pin.signalClass,
    colour: pin.colour,
    sizeMm2: pin.sizeMm2,
    insulationRatingC: pin.insulationRatingC,
    disposition: pin.disposition,
    destination: pin.destination,
    destinationPinId: pin.destinationPinId,
    destinationFeedId: pin.destinationFeedId,
    runLengthM: pin.runLengthM,
    loadCurrentA: pin.loadCurrentA,
    driverType: pin.driverType ?? null,
    driverRatedA: pin.driverRatedA ?? null,
    pulseSignal: pin.pulseSignal ?? null,
    pulsesPerRev: pin.pulsesPerRev ?? null,
    terminationOhm: pin.terminationOhm ?? null,
    notes: pin.notes,
    version: pin.version,
    updatedAt: new Date(pin.updatedAt).toISOString(),
  };
}

export function toConnectorDto(connector: Connector): ConnectorDto {
  return {
    id: connector.id,
    conversionId: connector.conversionId,
    label: connector.label,
    side: connector.side,
    cavityCount: connector.cavityCount,
    rows: connector.rows,
    columns: connector.columns,
    notes: connector.notes,
    version: connector.version,
  };
}
