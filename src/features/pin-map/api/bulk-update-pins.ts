import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type { BulkPinRequest, Pin } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys, pinWriteScope } from './keys.ts';
import { pinWriteCache, type PinWrite, type PinWriteListeners } from './pin-write-cache.ts';

export type BulkPinWrite = Extract<PinWrite, { kind: 'bulk' }>;

export const bulkUpdatePins = (conversionId: number, input: BulkPinRequest) =>
  api.post<{ pins: Pin[] }>(`/api/conversions/${conversionId}/pins/bulk`, input);

export function bulkUpdatePinsMutationOptions(
  queryClient: QueryClient,
  conversionId: number,
  listeners: PinWriteListeners,
) {
  const cache = pinWriteCache(queryClient, conversionId, listeners);
  return mutationOptions({
    mutationKey: [...pinMapKeys.pinWrites(conversionId), 'bulk'],
    scope: pinWriteScope(conversionId),
    mutationFn: async (write: BulkPinWrite) =>
      (await bulkUpdatePins(conversionId, { pinIds: write.pinIds, set: write.set })).pins,
    onMutate: cache.onMutate,
    onSuccess: cache.onSuccess,
    onError: cache.onError,
  });
}

/** The same values on every selected pin, all or nothing. */
export function useBulkUpdatePins(conversionId: number, listeners: PinWriteListeners) {
  const queryClient = useQueryClient();
  return useMutation(bulkUpdatePinsMutationOptions(queryClient, conversionId, listeners));
}
