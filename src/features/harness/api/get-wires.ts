import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Wire } from '#shared/schemas/harness.schema.ts';
import { api } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export const getWires = (conversionId: number) =>
  api.get<{ wires: Wire[] }>(`/api/conversions/${conversionId}/wires`);

export const getWiresQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: harnessKeys.wires(conversionId),
    queryFn: async () => (await getWires(conversionId)).wires,
  });

export const useWires = (conversionId: number) => useQuery(getWiresQueryOptions(conversionId));

/** Where the wire list comes as CSV (a plain link: the browser downloads it). */
export const wiresCsvHref = (conversionId: number) => `/api/conversions/${conversionId}/wires.csv`;
