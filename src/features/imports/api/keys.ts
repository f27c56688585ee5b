import type { ImportTarget } from '../lib/import-target.ts';
import { targetKey } from '../lib/import-target.ts';

/** Mutation keys of the import: a preview and an apply per target. */
export const importKeys = {
  all: ['imports'] as const,
  preview: (target: ImportTarget) => [...importKeys.all, 'preview', targetKey(target)] as const,
  apply: (target: ImportTarget) => [...importKeys.all, 'apply', targetKey(target)] as const,
};
