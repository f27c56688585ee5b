import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client.ts';
import { attachmentKeys } from './keys.ts';

export const deleteAttachment = (id: number) => api.delete<void>(`/api/attachments/${id}`);

export function useDeleteAttachment(connectorId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAttachment,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: attachmentKeys.list(connectorId) }),
  });
}
