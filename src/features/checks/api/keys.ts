/** Query keys for the circuit checks and the names their links show. */
export const checkKeys = {
  all: ['checks'] as const,
  conversion: (conversionId: number) => [...checkKeys.all, conversionId] as const,
  report: (conversionId: number) => [...checkKeys.conversion(conversionId), 'report'] as const,
  pins: (conversionId: number) => [...checkKeys.conversion(conversionId), 'pins'] as const,
  connectors: (conversionId: number) =>
    [...checkKeys.conversion(conversionId), 'connectors'] as const,
  feeds: (conversionId: number) => [...checkKeys.conversion(conversionId), 'feeds'] as const,
};
