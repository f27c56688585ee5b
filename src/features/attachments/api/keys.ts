/** Query keys of reference scans: every variable a query uses is part of its key. */
export const attachmentKeys = {
  all: ['attachments'] as const,
  lists: () => [...attachmentKeys.all, 'list'] as const,
  list: (connectorId: number) => [...attachmentKeys.lists(), connectorId] as const,
};
