import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type { BatchPinRequest, Pin } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys, pinWriteScope } from './keys.ts';
import { pinWriteCache, type PinWrite, type PinWriteListeners } from './pin-write-cache.ts';

export type BatchPinWrite = Extract<PinWrite, { kind: 'batch' }>;

export const batchUpdatePins = (conversionId: number, input: BatchPinRequest) =>
  api.post<{ pins: Pin[] }>(`/api/conversions/${conversionId}/pins/batch`, input);

export function batchUpdatePinsMutationOptions(
  queryClient: QueryClient,
  conversionId: number,
  listeners: PinWriteListeners,
) {
  const cache = pinWriteCache(queryClient, conversionId, listeners);
  return mutationOptions({
    mutationKey: [...pinMapKeys.pinWrites(conversionId), 'batch'],
    scope: pinWriteScope(conversionId),
    mutationFn: async (write: BatchPinWrite) => {
      // Each row against the version the cache holds now; any stale row refuses the whole batch.
      const changes = write.edits.map((e) => ({
        id: e.id,
        version: cache.versionOf(e.id),
        set: e.set,
      }));
      return (await batchUpdatePins(conversionId, { changes })).pins;
    },
    onMutate: cache.onMutate,
    onSuccess: cache.onSuccess,
    onError: cache.onError,
  });
}

/** Different values on several pins in one request (paste, fill down, undo). */
export function useBatchUpdatePins(conversionId: number, listeners: PinWriteListeners) {
  const queryClient = useQueryClient();
  return useMutation(batchUpdatePinsMutationOptions(queryClient, conversionId, listeners));
}
