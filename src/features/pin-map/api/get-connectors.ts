import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { Connector } from '#shared/schemas/pin-map.schema.ts';
import { api } from '@/lib/api-client.ts';
import { pinMapKeys } from './keys.ts';

/** A connector as listed, with its pins counted by disposition when the list was read. */
export interface ConnectorSummary extends Connector {
  counts: Partial<Record<Disposition, number>>;
}

export const getConnectors = (conversionId: number) =>
  api.get<{ connectors: ConnectorSummary[] }>(`/api/conversions/${conversionId}/connectors`);

export const getConnectorsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: pinMapKeys.connectors(conversionId),
    queryFn: async () => (await getConnectors(conversionId)).connectors,
  });

export const useConnectors = (conversionId: number) =>
  useQuery(getConnectorsQueryOptions(conversionId));
