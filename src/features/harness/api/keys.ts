import { HARNESS_KEY_ROOT } from '@/lib/shared-keys.ts';

/** Query keys for the harness of one conversion: every variable a query uses is in its key. */
export const harnessKeys = {
  all: [HARNESS_KEY_ROOT] as const,
  conversion: (conversionId: number) => [...harnessKeys.all, conversionId] as const,
  wires: (conversionId: number) => [...harnessKeys.conversion(conversionId), 'wires'] as const,
  splices: (conversionId: number) => [...harnessKeys.conversion(conversionId), 'splices'] as const,
  groundPoints: (conversionId: number) =>
    [...harnessKeys.conversion(conversionId), 'ground-points'] as const,
  boxes: (conversionId: number) => [...harnessKeys.conversion(conversionId), 'boxes'] as const,
};
