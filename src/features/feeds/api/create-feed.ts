import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateFeedRequest, Feed } from '#shared/schemas/feeds.schema.ts';
import { api } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

export const createFeed = (conversionId: number, input: CreateFeedRequest) =>
  api.post<{ feed: Feed }>(`/api/conversions/${conversionId}/feeds`, input);

export function useCreateFeed(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateFeedRequest) => createFeed(conversionId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: feedKeys.lists(conversionId) }),
  });
}
