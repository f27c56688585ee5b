import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys } from './keys.ts';

export const deleteConnector = (connectorId: number) =>
  api.delete<void>(`/api/connectors/${connectorId}`);

export function useDeleteConnector(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (connectorId: number) => deleteConnector(connectorId),
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: pinMapKeys.connectors(conversionId) }),
        queryClient.invalidateQueries({ queryKey: pinMapKeys.pins(conversionId) }),
      ]),
  });
}
