import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Pin } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { checkKeys } from './keys.ts';

/** The conversion's pins, to name the pins a finding links to. */
export const getPins = (conversionId: number) =>
  api.get<{ pins: Pin[] }>(`/api/conversions/${conversionId}/pins`);

export const getPinsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: checkKeys.pins(conversionId),
    queryFn: async () => (await getPins(conversionId)).pins,
  });

export const usePins = (conversionId: number, enabled = true) =>
  useQuery({ ...getPinsQueryOptions(conversionId), enabled });
