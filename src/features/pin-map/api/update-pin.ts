import {
  mutationOptions,
  useMutation,
  useQueryClient,
  type QueryClient,
} from '@tanstack/react-query';
import type { Pin, UpdatePinRequest } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys, pinWriteScope } from './keys.ts';
import { pinWriteCache, type PinWrite, type PinWriteListeners } from './pin-write-cache.ts';

export type UpdatePinWrite = Extract<PinWrite, { kind: 'single' }>;

export const updatePin = (pinId: number, input: UpdatePinRequest) =>
  api.patch<{ pin: Pin }>(`/api/pins/${pinId}`, input);

export function updatePinMutationOptions(
  queryClient: QueryClient,
  conversionId: number,
  listeners: PinWriteListeners,
) {
  const cache = pinWriteCache(queryClient, conversionId, listeners);
  return mutationOptions({
    mutationKey: [...pinMapKeys.pinWrites(conversionId), 'update'],
    scope: pinWriteScope(conversionId),
    mutationFn: async (write: UpdatePinWrite) => {
      const version = cache.versionOf(write.edit.id);
      const { pin } = await updatePin(write.edit.id, { ...write.edit.set, version });
      return [pin];
    },
    onMutate: cache.onMutate,
    onSuccess: cache.onSuccess,
    onError: cache.onError,
  });
}

/** One pin's changes, checked against the version the cache holds when the write runs. */
export function useUpdatePin(conversionId: number, listeners: PinWriteListeners) {
  const queryClient = useQueryClient();
  return useMutation(updatePinMutationOptions(queryClient, conversionId, listeners));
}
