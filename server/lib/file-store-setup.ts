import { startOnPortOrAnother } from './ports.ts';
import path from 'node:path';
import type { Env } from '../config/env.ts';
import { S3FileStore, setFileStore, uploadDir } from './file-store.ts';
import { logger } from './logger.ts';
import { startS3Fake } from './s3-fake.ts';

/**
 * Chooses where uploaded files go. A configured S3 endpoint wins; in demo mode without one, a local
 * S3 fake is started on 127.0.0.1 with its objects under the data folder; otherwise a plain folder.
 * Returns a function that stops what was started.
 */
export async function startFileStore(env: Env): Promise<() => Promise<void>> {
  if (env.S3_ENDPOINT) {
    logger.info({ endpoint: env.S3_ENDPOINT, bucket: env.S3_BUCKET }, 'files are stored in S3');
    return async () => {};
  }
  if (!env.DEMO) {
    logger.info({ folder: uploadDir(env) }, 'no S3_ENDPOINT: files are stored in a local folder');
    return async () => {};
  }
  const directory = path.join(env.DATA_DIR, 's3');
  const fake = await startOnPortOrAnother('S3 fake', env.S3_FAKE_PORT, (port) =>
    startS3Fake({ directory, bucket: env.S3_BUCKET, port }),
  );
  const store = new S3FileStore({
    endpoint: fake.endpoint,
    bucket: env.S3_BUCKET,
    region: env.S3_REGION,
    ...fake.credentials,
  });
  setFileStore(store);
  logger.info(
    { endpoint: fake.endpoint, bucket: env.S3_BUCKET, directory },
    'demo mode: files go to the local S3 fake',
  );
  return async () => {
    setFileStore(null);
    store.destroy();
    await fake.close();
  };
}
