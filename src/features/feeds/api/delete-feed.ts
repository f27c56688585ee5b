import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';
import { feedKeys } from './keys.ts';

export const deleteFeed = (conversionId: number, feedId: number) =>
  api.delete<void>(`/api/conversions/${conversionId}/feeds/${feedId}`);

export function useDeleteFeed(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (feedId: number) => deleteFeed(conversionId, feedId),
    // Not awaited, and the cache is left to the refetch: the caller closes the deleted feed's form
    // first, rather than the form finding its feed gone from under it.
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: feedKeys.lists(conversionId) });
    },
  });
}
