import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Connector, UpdateConnectorRequest } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys } from './keys.ts';

export const updateConnector = (connectorId: number, input: UpdateConnectorRequest) =>
  api.patch<{ connector: Connector }>(`/api/connectors/${connectorId}`, input);

/** A changed cavity count adds or removes pins, and a new label renames them: both lists refresh. */
export function useUpdateConnector(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ connectorId, input }: { connectorId: number; input: UpdateConnectorRequest }) =>
      updateConnector(connectorId, input),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: pinMapKeys.connectors(conversionId) }),
        queryClient.invalidateQueries({ queryKey: pinMapKeys.pins(conversionId) }),
      ]),
  });
}
