import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys } from './keys.ts';

export const getPins = (conversionId: number) =>
  api.get<{ pins: Pin[] }>(`/api/conversions/${conversionId}/pins`);

export const getPinsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: pinMapKeys.pins(conversionId),
    queryFn: async () => (await getPins(conversionId)).pins,
  });

export const usePins = (conversionId: number) => useQuery(getPinsQueryOptions(conversionId));
