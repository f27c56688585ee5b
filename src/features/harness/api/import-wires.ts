import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError } from '@/lib/api-client.ts';
import { harnessKeys } from './keys.ts';

export interface WireImportResult {
  rows: number;
  imported: number;
  errors: Array<{ row: number; column: string; message: string }>;
}

/**
 * POST …/wires/import (dryRun=1 for a preview). A refused file answers 422 with the same
 * {rows, imported, errors} body, not the usual error shape, so it is read here rather than thrown.
 */
export async function importWires(conversionId: number, file: File, dryRun: boolean) {
  const form = new FormData();
  form.append('file', file, file.name);
  const url = `/api/conversions/${conversionId}/wires/import${dryRun ? '?dryRun=1' : ''}`;
  let response: Response;
  try {
    response = await fetch(url, {
      method: 'POST',
      body: form,
      credentials: 'same-origin',
      headers: { Accept: 'application/json' },
    });
  } catch {
    throw new ApiError(0, 'network', 'Could not reach the Loomwright server.');
  }
  const body = (await response.json().catch(() => null)) as
    (WireImportResult & { error?: { code: string; message: string } }) | null;
  if (body && Array.isArray(body.errors)) return body as WireImportResult;
  throw new ApiError(
    response.status,
    body?.error?.code ?? 'http_error',
    body?.error?.message ?? `The server answered ${response.status}.`,
  );
}

export function useImportWires(conversionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, dryRun }: { file: File; dryRun: boolean }) =>
      importWires(conversionId, file, dryRun),
    onSuccess: (result, { dryRun }) => {
      if (!dryRun && result.errors.length === 0) {
        return queryClient.invalidateQueries({ queryKey: harnessKeys.conversion(conversionId) });
      }
    },
  });
}
