import { useMutation } from '@tanstack/react-query';
import type { ImportResult } from '#shared/schemas/imports.schema.ts';
import { api } from '@/lib/api-client.ts';
import { importUrl, type ImportTarget } from '../lib/import-target.ts';
import { importForm, type ImportInput } from './form.ts';
import { importKeys } from './keys.ts';

/**
 * POST …/import?dryRun=1: what the file holds and would change, one page of its lines at a time;
 * nothing is written.
 */
export const previewImport = (target: ImportTarget, input: ImportInput) =>
  api.post<ImportResult>(
    `${importUrl(target, true)}${input.page && input.page > 1 ? `&page=${input.page}` : ''}`,
    importForm(input),
  );

export function usePreviewImport(target: ImportTarget) {
  return useMutation({
    mutationKey: importKeys.preview(target),
    mutationFn: (input: ImportInput) => previewImport(target, input),
  });
}
