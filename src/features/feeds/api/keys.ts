/** Query keys for feeds and the pin lists their pickers use: every variable a query uses is in its key. */
export const feedKeys = {
  all: ['feeds'] as const,
  conversion: (conversionId: number) => [...feedKeys.all, conversionId] as const,
  lists: (conversionId: number) => [...feedKeys.conversion(conversionId), 'list'] as const,
  pins: (conversionId: number) => [...feedKeys.conversion(conversionId), 'pins'] as const,
  connectors: (conversionId: number) =>
    [...feedKeys.conversion(conversionId), 'connectors'] as const,
};
