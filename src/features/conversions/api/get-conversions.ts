import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ConversionListItem } from '#shared/schemas/conversions.schema.ts';
import { api } from '@/lib/api-client.ts';
import { conversionKeys } from './keys.ts';

export const getConversions = () =>
  api.get<{ conversions: ConversionListItem[] }>('/api/conversions');

export const getConversionsQueryOptions = () =>
  queryOptions({
    queryKey: conversionKeys.lists(),
    queryFn: async () => (await getConversions()).conversions,
  });

export const useConversions = () => useQuery(getConversionsQueryOptions());
