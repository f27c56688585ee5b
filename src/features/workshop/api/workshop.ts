import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { UpdateWorkshopRequest, WorkshopSettings } from '#shared/schemas/workshop.schema.ts';
import { api } from '@/lib/api-client.ts';

export const workshopKeys = { all: ['workshop'] as const };

export const getWorkshop = () => api.get<{ workshop: WorkshopSettings }>('/api/workshop');

export const getWorkshopQueryOptions = () =>
  queryOptions({ queryKey: workshopKeys.all, queryFn: async () => (await getWorkshop()).workshop });

export const useWorkshop = () => useQuery(getWorkshopQueryOptions());

export const updateWorkshop = (input: UpdateWorkshopRequest) =>
  api.patch<{ workshop: WorkshopSettings }>('/api/workshop', input);

export function useUpdateWorkshop() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateWorkshop,
    onSuccess: ({ workshop }) => queryClient.setQueryData(workshopKeys.all, workshop),
  });
}
