import {
  BLANK_PIN_VALUES,
  type Connector,
  type Pin,
} from '../../../shared/schemas/pin-map.schema.ts';

/** Invented connectors and pins for the pin map's pure functions. */
export function connector(overrides: Partial<Connector> = {}): Connector {
  return {
    id: 1,
    conversionId: 1,
    label: 'E1',
    side: 'ecu',
    cavityCount: 4,
    rows: 1,
    columns: 4,
    notes: '',
    version: 0,
    ...overrides,
  };
}

export function pin(overrides: Partial<Pin> = {}): Pin {
  const id = overrides.id ?? 1;
  return {
    id,
    connectorId: 1,
    conversionId: 1,
    cavity: String(id),
    position: id - 1,
    ...BLANK_PIN_VALUES,
    version: 0,
    updatedAt: '2025-01-01T00:00:00.000Z',
    ...overrides,
  };
}
