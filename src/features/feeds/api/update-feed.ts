import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Feed, UpdateFeedRequest } from '#shared/schemas/feeds.schema.ts';
import { api, ApiError } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

export const updateFeed = (conversionId: number, feedId: number, input: UpdateFeedRequest) =>
  api.patch<{ feed: Feed }>(`/api/conversions/${conversionId}/feeds/${feedId}`, input);

/** The server's copy attached to a 409 version conflict, or null for any other error. */
export function conflictCopy(error: unknown): Feed | null {
  if (!(error instanceof ApiError) || error.code !== 'version_conflict') return null;
  const current = (error.details as { current?: Feed } | undefined)?.current;
  return current ?? null;
}

function replaceInList(list: Feed[] | undefined, feed: Feed): Feed[] | undefined {
  return list?.map((f) => (f.id === feed.id ? feed : f));
}

export function useUpdateFeed(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ feedId, input }: { feedId: number; input: UpdateFeedRequest }) =>
      updateFeed(conversionId, feedId, input),
    onSuccess: ({ feed }) => {
      queryClient.setQueryData<Feed[]>(feedKeys.lists(conversionId), (list) =>
        replaceInList(list, feed),
      );
      return queryClient.invalidateQueries({ queryKey: feedKeys.lists(conversionId) });
    },
    onError: (error) => {
      // Someone else saved first: show their copy everywhere, the form reloads from it.
      const current = conflictCopy(error);
      if (current) {
        queryClient.setQueryData<Feed[]>(feedKeys.lists(conversionId), (list) =>
          replaceInList(list, current),
        );
      }
    },
  });
}
