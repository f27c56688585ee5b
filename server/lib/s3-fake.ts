import { mkdir } from 'node:fs/promises';

/** Credentials s3rver checks request signatures against. */
export const S3_FAKE_CREDENTIALS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' } as const;

export interface S3Fake {
  endpoint: string;
  port: number;
  close: () => Promise<void>;
}

/**
 * A local S3-compatible server (s3rver) on 127.0.0.1 that keeps objects in `directory`, with
 * `bucket` created at start: demo mode and the tests store files through the real S3 SDK against
 * it. Loaded on demand so production never loads it.
 */
export async function startS3Fake(options: {
  directory: string;
  bucket: string;
  port?: number;
}): Promise<S3Fake> {
  await mkdir(options.directory, { recursive: true, mode: 0o700 });
  const { default: S3rver } = await import('s3rver');
  const server = new S3rver({
    address: '127.0.0.1',
    port: options.port ?? 0,
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket }],
  });
  const address = await server.run();
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    port: address.port,
    close: () => server.close(),
  };
}
