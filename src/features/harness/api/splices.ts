import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateSpliceRequest, Splice } from '#shared/schemas/harness.schema.ts';
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
