import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Attachment } from '#shared/schemas/attachments.schema.ts';
import { api } from '@/lib/api-client.ts';
import { attachmentKeys } from './keys.ts';

export const getAttachments = (connectorId: number) =>
  api.get<{ attachments: Attachment[] }>(`/api/connectors/${connectorId}/attachments`);

export const getAttachmentsQueryOptions = (connectorId: number) =>
  queryOptions({
    queryKey: attachmentKeys.list(connectorId),
    queryFn: async () => (await getAttachments(connectorId)).attachments,
  });

export const useAttachments = (connectorId: number) =>
  useQuery(getAttachmentsQueryOptions(connectorId));

/** Downloads go through the authorised route, which answers with Content-Disposition: attachment. */
export const attachmentHref = (id: number) => `/api/attachments/${id}`;
