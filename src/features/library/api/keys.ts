/** Query keys of the pinout library: every variable a query uses is part of its key. */
export const libraryKeys = {
  all: ['library'] as const,
  lists: () => [...libraryKeys.all, 'list'] as const,
  details: () => [...libraryKeys.all, 'detail'] as const,
  detail: (id: number) => [...libraryKeys.details(), id] as const,
};
