import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateWireRequest, Wire } from '#shared/schemas/harness.schema.ts';
import { api, ApiError } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const updateWire = (wireId: number, input: UpdateWireRequest) =>
  api.patch<{ wire: Wire }>(`/api/wires/${wireId}`, input);

/** The server's copy attached to a 409 version conflict, or null for any other error. */
export function conflictWire(error: unknown): Wire | null {
  if (!(error instanceof ApiError) || error.code !== 'version_conflict') return null;
  return (error.details as { current?: Wire } | undefined)?.current ?? null;
}

const replace = (list: Wire[] | undefined, wire: Wire) =>
  list?.map((w) => (w.id === wire.id ? wire : w));

export function useUpdateWire(conversionId: number) {
  const queryClient = useQueryClient();
  const key = harnessKeys.wires(conversionId);
  return useMutation({
    mutationFn: ({ wireId, input }: { wireId: number; input: UpdateWireRequest }) =>
      updateWire(wireId, input),
    onSuccess: ({ wire }) => {
      queryClient.setQueryData<Wire[]>(key, (list) => replace(list, wire));
    },
    onError: (error) => {
      // Someone else saved first: the row shows their copy, and the next edit starts from it.
      const current = conflictWire(error);
      if (current) queryClient.setQueryData<Wire[]>(key, (list) => replace(list, current));
    },
  });
}
