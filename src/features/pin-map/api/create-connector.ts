import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Connector, CreateConnectorRequest } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys } from './keys.ts';

export const createConnector = (conversionId: number, input: CreateConnectorRequest) =>
  api.post<{ connector: Connector }>(`/api/conversions/${conversionId}/connectors`, input);

/** A new connector brings its cavities as undecided pins: both lists are read again. */
export function useCreateConnector(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateConnectorRequest) => createConnector(conversionId, input),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: pinMapKeys.connectors(conversionId) }),
        queryClient.invalidateQueries({ queryKey: pinMapKeys.pins(conversionId) }),
      ]),
  });
}
