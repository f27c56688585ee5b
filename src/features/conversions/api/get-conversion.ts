import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Conversion } from '#shared/schemas/conversions.schema.ts';
import { api } from '@/lib/api-client.ts';
import { conversionKeys } from './keys.ts';

export const getConversion = (id: number) =>
  api.get<{ conversion: Conversion }>(`/api/conversions/${id}`);

export const getConversionQueryOptions = (id: number) =>
  queryOptions({
    queryKey: conversionKeys.detail(id),
    queryFn: async () => (await getConversion(id)).conversion,
  });

export const useConversion = (id: number) => useQuery(getConversionQueryOptions(id));
