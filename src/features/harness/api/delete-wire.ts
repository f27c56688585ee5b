import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Wire } from '#shared/schemas/harness.schema.ts';
import { api } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const deleteWire = (wireId: number) => api.delete<void>(`/api/wires/${wireId}`);

export function useDeleteWire(conversionId: number) {
  const queryClient = useQueryClient();
  const key = harnessKeys.wires(conversionId);
  return useMutation({
    mutationFn: (wireId: number) => deleteWire(wireId),
    onSuccess: (_v, wireId) => {
      queryClient.setQueryData<Wire[]>(key, (list) => list?.filter((w) => w.id !== wireId));
      return queryClient.invalidateQueries({ queryKey: key });
    },
  });
}
