import { FEEDS_KEY_ROOT } from '@/lib/shared-keys.ts';

/** Query keys for feeds: every variable a query uses is in its key. */
export const feedKeys = {
  all: [FEEDS_KEY_ROOT] as const,
  conversion: (conversionId: number) => [...feedKeys.all, conversionId] as const,
  lists: (conversionId: number) => [...feedKeys.conversion(conversionId), 'list'] as const,
};
