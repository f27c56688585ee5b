import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Feed } from '#shared/schemas/feeds.schema.ts';
import { api } from '@/lib/api-client.ts';
import { checkKeys } from './keys.ts';

/** The conversion's feeds, to name the feed a finding links to. */
export const getFeeds = (conversionId: number) =>
  api.get<{ feeds: Feed[] }>(`/api/conversions/${conversionId}/feeds`);

export const getFeedsQueryOptions = (conversionId: number) =>
  queryOptions({
    queryKey: checkKeys.feeds(conversionId),
    queryFn: async () => (await getFeeds(conversionId)).feeds,
  });

export const useFeeds = (conversionId: number, enabled = true) =>
  useQuery({ ...getFeedsQueryOptions(conversionId), enabled });
