import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

/** The conversion's pins, for the relay-coil and load pickers. */
export const getPins = (conversionId: number) =>
  api.get<{ pins: Pin[] }>(`/api/conversions/${conversionId}/pins`);

export const getPinsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: feedKeys.pins(conversionId),
    queryFn: async () => (await getPins(conversionId)).pins,
  });

export const usePins = (conversionId: number) => useQuery(getPinsQueryOptions(conversionId));
