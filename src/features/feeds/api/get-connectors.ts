import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Connector } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

/** The conversion's connectors, to name pins "E2-9" in the pickers. */
export const getConnectors = (conversionId: number) =>
  api.get<{ connectors: Connector[] }>(`/api/conversions/${conversionId}/connectors`);

export const getConnectorsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: feedKeys.connectors(conversionId),
    queryFn: async () => (await getConnectors(conversionId)).connectors,
  });

export const useConnectors = (conversionId: number) =>
  useQuery(getConnectorsQueryOptions(conversionId));
