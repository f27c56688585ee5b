import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PinoutTemplate } from '#shared/schemas/library.schema.ts';
import { api } from '@/lib/api-client.ts';
import { libraryKeys } from './keys.ts';

export const getTemplates = () =>
  api.get<{ templates: PinoutTemplate[] }>('/api/library/templates');

export const getTemplatesQueryOptions = () =>
  queryOptions({
    queryKey: libraryKeys.lists(),
    queryFn: async () => (await getTemplates()).templates,
  });

export const useTemplates = () => useQuery(getTemplatesQueryOptions());
