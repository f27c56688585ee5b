import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';
import { libraryKeys } from './keys.ts';

export const deleteTemplate = (id: number) => api.delete<void>(`/api/library/templates/${id}`);

export function useDeleteTemplate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteTemplate,
    onSuccess: (_data, id) => {
      queryClient.removeQueries({ queryKey: libraryKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: libraryKeys.lists() });
    },
  });
}
