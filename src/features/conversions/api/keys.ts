/** Query keys for conversions: every variable a query uses is part of its key. */
export const conversionKeys = {
  all: ['conversions'] as const,
  lists: () => [...conversionKeys.all, 'list'] as const,
  details: () => [...conversionKeys.all, 'detail'] as const,
  detail: (id: number) => [...conversionKeys.details(), id] as const,
};
