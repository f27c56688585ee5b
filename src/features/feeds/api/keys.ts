/** Query keys for feeds: every variable a query uses is in its key. */
export const feedKeys = {
  all: ['feeds'] as const,
  conversion: (conversionId: number) => [...feedKeys.all, conversionId] as const,
  lists: (conversionId: number) => [...feedKeys.conversion(conversionId), 'list'] as const,
};
