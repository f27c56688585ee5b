import { useMutation } from '@tanstack/react-query';
import type { ImportResult } from '#shared/schemas/imports.schema.ts';
import { ApiError, api } from '@/lib/api-client.ts';
import { importUrl, type ImportTarget } from '../lib/import-target.ts';
import { importForm, type ImportInput } from './form.ts';
import { importKeys } from './keys.ts';

/**
 * POST …/import: all of the file in one transaction, or nothing (422 with the problems). The
 * preview the person just looked at is applied by its id, without sending the file again; when
 * the server no longer keeps it (the pin map changed, or it is old), the file is sent.
 */
export async function applyImport(target: ImportTarget, input: ImportInput): Promise<ImportResult> {
  const query = new URLSearchParams();
  if (input.grow) query.set('grow', '1');
  if (input.previewId) {
    const byId = new URLSearchParams(query);
    byId.set('preview', input.previewId);
    try {
      return await api.post<ImportResult>(`${importUrl(target, false)}?${byId}`);
    } catch (error) {
      if (!(error instanceof ApiError && error.code === 'preview_gone')) throw error;
    }
  }
  const rest = query.size ? `?${query}` : '';
  return api.post<ImportResult>(`${importUrl(target, false)}${rest}`, importForm(input));
}

/** The problems of a refused import (422), in the same shape as a preview. */
export function refusedResult(error: unknown): Omit<ImportResult, 'table'> | null {
  if (!(error instanceof ApiError) || error.status !== 422) return null;
  const details = error.details as Partial<ImportResult> | undefined;
  return details && Array.isArray(details.errors) ? (details as ImportResult) : null;
}

/**
 * `onApplied` lets the route refresh what the import changed (the pin map's queries belong to
 * another feature).
 */
export function useApplyImport(target: ImportTarget, onApplied?: (result: ImportResult) => void) {
  return useMutation({
    mutationKey: importKeys.apply(target),
    mutationFn: (input: ImportInput) => applyImport(target, input),
    onSuccess: (result) => onApplied?.(result),
  });
}
