/** Query keys for the circuit checks. */
export const checkKeys = {
  all: ['checks'] as const,
  conversion: (conversionId: number) => [...checkKeys.all, conversionId] as const,
  report: (conversionId: number) => [...checkKeys.conversion(conversionId), 'report'] as const,
};
