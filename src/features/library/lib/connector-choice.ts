import { CONNECTOR_SIDE_LABELS, type Connector } from '#shared/schemas/pin-map.schema.ts';

export interface ConnectorChoice {
  id: number;
  label: string;
  /** "ECU side, 28 cavities". */
  detail: string;
}

/** A conversion's connector as the save-as-template form offers it. */
export function connectorChoice(
  connector: Pick<Connector, 'id' | 'label' | 'side' | 'cavityCount'>,
): ConnectorChoice {
  const n = connector.cavityCount;
  return {
    id: connector.id,
    label: connector.label,
    detail: `${CONNECTOR_SIDE_LABELS[connector.side]}, ${n} ${n === 1 ? 'cavity' : 'cavities'}`,
  };
}
