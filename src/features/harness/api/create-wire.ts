import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateWireRequest, Wire } from '#shared/schemas/harness.schema.ts';
import { api } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const createWire = (conversionId: number, input: CreateWireRequest) =>
  api.post<{ wire: Wire }>(`/api/conversions/${conversionId}/wires`, input);

export function useCreateWire(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateWireRequest) => createWire(conversionId, input),
    onSuccess: ({ wire }) => {
      queryClient.setQueryData<Wire[]>(harnessKeys.wires(conversionId), (list) =>
        list ? [...list, wire] : list,
      );
      return queryClient.invalidateQueries({ queryKey: harnessKeys.wires(conversionId) });
    },
  });
}
