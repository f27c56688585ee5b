import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CreateGroundPointRequest,
  GroundPoint,
  UpdateGroundPointRequest,
} from '#shared/schemas/harness.schema.ts';
import { api } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const getGroundPoints = (conversionId: number) =>
  api.get<{ groundPoints: GroundPoint[] }>(`/api/conversions/${conversionId}/ground-points`);

export const getGroundPointsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: harnessKeys.groundPoints(conversionId),
    queryFn: async () => (await getGroundPoints(conversionId)).groundPoints,
  });

export const useGroundPoints = (conversionId: number) =>
  useQuery(getGroundPointsQueryOptions(conversionId));

export const createGroundPoint = (conversionId: number, input: CreateGroundPointRequest) =>
  api.post<{ groundPoint: GroundPoint }>(`/api/conversions/${conversionId}/ground-points`, input);

export function useCreateGroundPoint(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateGroundPointRequest) => createGroundPoint(conversionId, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: harnessKeys.groundPoints(conversionId) }),
  });
}

export const updateGroundPoint = (
  conversionId: number,
  groundPointId: number,
  input: UpdateGroundPointRequest,
) =>
  api.patch<{ groundPoint: GroundPoint }>(
    `/api/conversions/${conversionId}/ground-points/${groundPointId}`,
    input,
  );

/** Changes a ground point; its label shows in wire ends too, so the whole harness is read again. */
export function useUpdateGroundPoint(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: UpdateGroundPointRequest }) =>
      updateGroundPoint(conversionId, id, input),
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: harnessKeys.conversion(conversionId) }),
  });
}

export const deleteGroundPoint = (conversionId: number, groundPointId: number) =>
  api.delete<void>(`/api/conversions/${conversionId}/ground-points/${groundPointId}`);

export function useDeleteGroundPoint(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (groundPointId: number) => deleteGroundPoint(conversionId, groundPointId),
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: harnessKeys.groundPoints(conversionId) }),
  });
}
