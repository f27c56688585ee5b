import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Attachment } from '#shared/schemas/attachments.schema.ts';
import { api } from '@/lib/api-client.ts';
import { attachmentKeys } from './keys.ts';

export const uploadAttachment = (connectorId: number, file: File) => {
  const form = new FormData();
  form.append('file', file, file.name);
  return api.post<{ attachment: Attachment }>(`/api/connectors/${connectorId}/attachments`, form);
};

export function useUploadAttachment(connectorId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadAttachment(connectorId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: attachmentKeys.list(connectorId) }),
  });
}
