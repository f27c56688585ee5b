import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Feed } from '#shared/schemas/feeds.schema.ts';
import { api } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

export const getFeeds = (conversionId: number) =>
  api.get<{ feeds: Feed[] }>(`/api/conversions/${conversionId}/feeds`);

export const getFeedsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: feedKeys.lists(conversionId),
    queryFn: async () => (await getFeeds(conversionId)).feeds,
  });

export const useFeeds = (conversionId: number) => useQuery(getFeedsQueryOptions(conversionId));
