/** Where each cavity sits on a connector's face: rows × columns, filled row by row. */
import type { Connector, Pin } from '#shared/schemas/pin-map.schema.ts';

export interface FaceCavity {
  pin: Pin;
  row: number;
  column: number;
}

export function faceCavities(connector: Connector, pins: readonly Pin[]): FaceCavity[] {
  const columns = Math.max(1, connector.columns);
  return pins
    .filter((p) => p.connectorId === connector.id)
    .map((pin) => ({
      pin,
      row: Math.floor(pin.position / columns),
      column: pin.position % columns,
    }));
}
