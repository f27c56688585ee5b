import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PinoutTemplateDetail } from '#shared/schemas/library.schema.ts';
import { api } from '@/lib/api-client.ts';
import { libraryKeys } from './keys.ts';

export const getTemplate = (id: number) =>
  api.get<{ template: PinoutTemplateDetail }>(`/api/library/templates/${id}`);

export const getTemplateQueryOptions = (id: number) =>
  queryOptions({
    queryKey: libraryKeys.detail(id),
    queryFn: async () => (await getTemplate(id)).template,
  });

export const useTemplate = (id: number) => useQuery(getTemplateQueryOptions(id));
