import { useMutation } from '@tanstack/react-query';
import type { ConnectorFromTemplateRequest } from '#shared/schemas/library.schema.ts';
import type { Connector } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';

export const createConnectorFromTemplate = (
  conversionId: number,
  input: ConnectorFromTemplateRequest,
) =>
  api.post<{ connector: Connector }>(
    `/api/conversions/${conversionId}/connectors/from-template`,
    input,
  );

/** `onCreated` lets the route refresh the pin map, whose queries belong to another feature. */
export function useCreateConnectorFromTemplate(
  conversionId: number,
  onCreated?: (connector: Connector) => void,
) {
  return useMutation({
    mutationFn: (input: ConnectorFromTemplateRequest) =>
      createConnectorFromTemplate(conversionId, input),
    onSuccess: ({ connector }) => onCreated?.(connector),
  });
}
