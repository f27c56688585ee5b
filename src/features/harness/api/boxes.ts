import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Box, CreateBoxRequest, UpdateBoxRequest } from '#shared/schemas/harness.schema.ts';
import { api, ApiError } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const getBoxes = (conversionId: number) =>
  api.get<{ boxes: Box[] }>(`/api/conversions/${conversionId}/boxes`);

export const getBoxesQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: harnessKeys.boxes(conversionId),
    queryFn: async () => (await getBoxes(conversionId)).boxes,
  });

export const useBoxes = (conversionId: number) => useQuery(getBoxesQueryOptions(conversionId));

export const updateBox = (conversionId: number, boxId: number, input: UpdateBoxRequest) =>
  api.patch<{ box: Box }>(`/api/conversions/${conversionId}/boxes/${boxId}`, input);

/** The server's copy attached to a 409 version conflict, or null for any other error. */
export function conflictBox(error: unknown): Box | null {
  if (!(error instanceof ApiError) || error.code !== 'version_conflict') return null;
  return (error.details as { current?: Box } | undefined)?.current ?? null;
}

export function useUpdateBox(conversionId: number) {
  const queryClient = useQueryClient();
  const key = harnessKeys.boxes(conversionId);
  const replace = (box: Box) =>
    queryClient.setQueryData<Box[]>(key, (list) => list?.map((b) => (b.id === box.id ? box : b)));
  return useMutation({
    mutationFn: ({ boxId, input }: { boxId: number; input: UpdateBoxRequest }) =>
      updateBox(conversionId, boxId, input),
    onSuccess: ({ box }) => replace(box),
    onError: (error) => {
      const current = conflictBox(error);
      if (current) replace(current);
    },
  });
}

export const createBox = (conversionId: number, input: CreateBoxRequest) =>
  api.post<{ box: Box }>(`/api/conversions/${conversionId}/boxes`, input);

export function useCreateBox(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateBoxRequest) => createBox(conversionId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: harnessKeys.boxes(conversionId) }),
  });
}
