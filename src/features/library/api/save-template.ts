import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PinoutTemplateDetail, SaveTemplateRequest } from '#shared/schemas/library.schema.ts';
import { api } from '@/lib/api-client.ts';
import { libraryKeys } from './keys.ts';

export const saveTemplate = (input: SaveTemplateRequest) =>
  api.post<{ template: PinoutTemplateDetail }>('/api/library/templates', input);

export function useSaveTemplate() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveTemplate,
    onSuccess: ({ template }) => {
      queryClient.setQueryData(libraryKeys.detail(template.id), template);
      return queryClient.invalidateQueries({ queryKey: libraryKeys.lists() });
    },
  });
}
