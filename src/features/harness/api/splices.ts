import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CreateSpliceRequest,
  Splice,
  UpdateSpliceRequest,
} from '#shared/schemas/harness.schema.ts';
import { api } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const getSplices = (conversionId: number) =>
  api.get<{ splices: Splice[] }>(`/api/conversions/${conversionId}/splices`);

export const getSplicesQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: harnessKeys.splices(conversionId),
    queryFn: async () => (await getSplices(conversionId)).splices,
  });

export const useSplices = (conversionId: number) => useQuery(getSplicesQueryOptions(conversionId));

export const createSplice = (conversionId: number, input: CreateSpliceRequest) =>
  api.post<{ splice: Splice }>(`/api/conversions/${conversionId}/splices`, input);

export function useCreateSplice(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateSpliceRequest) => createSplice(conversionId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: harnessKeys.splices(conversionId) }),
  });
}

export const updateSplice = (conversionId: number, spliceId: number, input: UpdateSpliceRequest) =>
  api.patch<{ splice: Splice }>(`/api/conversions/${conversionId}/splices/${spliceId}`, input);

/** Changes a splice; its label shows in wire ends too, so the whole harness is read again. */
export function useUpdateSplice(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: UpdateSpliceRequest }) =>
      updateSplice(conversionId, id, input),
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: harnessKeys.conversion(conversionId) }),
  });
}

export const deleteSplice = (conversionId: number, spliceId: number) =>
  api.delete<void>(`/api/conversions/${conversionId}/splices/${spliceId}`);

export function useDeleteSplice(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (spliceId: number) => deleteSplice(conversionId, spliceId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: harnessKeys.splices(conversionId) }),
  });
}
