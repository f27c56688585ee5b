import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Connector } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { checkKeys } from './keys.ts';

/** The conversion's connectors, to name pins "E3-13". */
export const getConnectors = (conversionId: number) =>
  api.get<{ connectors: Connector[] }>(`/api/conversions/${conversionId}/connectors`);

export const getConnectorsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: checkKeys.connectors(conversionId),
    queryFn: async () => (await getConnectors(conversionId)).connectors,
  });

export const useConnectors = (conversionId: number, enabled = true) =>
  useQuery({ ...getConnectorsQueryOptions(conversionId), enabled });
