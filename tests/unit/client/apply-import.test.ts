/**
 * The import wizard applies the preview it showed by the preview's id and sends the file only
 * when the server no longer keeps that preview (`preview_gone`).
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import { applyImport } from '@/features/imports/api/apply-import.ts';

const target = { kind: 'connector', connectorId: 7, label: 'E9' } as const;
const previewId = '4a9c3f3e-2f4b-4a47-9a57-0d6f7a1e2b3c';
const file = new File(['cavity,function\n1,Knock sensor\n'], 'pinout.csv', { type: 'text/csv' });
const done = { dryRun: false, imported: 1 };

function answer(status: number, body: unknown) {
  return new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}

afterEach(() => vi.unstubAllGlobals());

describe('applying an import', () => {
  it('names the preview and sends no file while the server keeps it', async () => {
    const fetch = vi.fn(async () => answer(200, done));
    vi.stubGlobal('fetch', fetch);
    await expect(applyImport(target, { file, previewId, grow: true })).resolves.toEqual(done);
    expect(fetch).toHaveBeenCalledTimes(1);
    const [url, init] = fetch.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe(`/api/connectors/7/import?grow=1&preview=${previewId}`);
    expect(init.body).toBeUndefined();
  });

  it('sends the file when the preview is gone, and only then', async () => {
    const fetch = vi
      .fn()
      .mockResolvedValueOnce(
        answer(409, { error: { code: 'preview_gone', message: 'send the file again' } }),
      )
      .mockResolvedValueOnce(answer(200, done));
    vi.stubGlobal('fetch', fetch);
    await expect(applyImport(target, { file, previewId })).resolves.toEqual(done);
    const [url, init] = fetch.mock.calls[1] as [string, RequestInit];
    expect(url).toBe('/api/connectors/7/import');
    expect(init.body).toBeInstanceOf(FormData);
    expect(((init.body as FormData).get('file') as File).name).toBe('pinout.csv');
  });

  it('does not send the file again after any other refusal', async () => {
    const fetch = vi
      .fn()
      .mockResolvedValue(answer(409, { error: { code: 'confirm_growth', message: 'confirm' } }));
    vi.stubGlobal('fetch', fetch);
    await expect(applyImport(target, { file, previewId })).rejects.toMatchObject({
      code: 'confirm_growth',
    });
    expect(fetch).toHaveBeenCalledTimes(1);
  });
});
