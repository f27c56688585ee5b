import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import { mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import type { Env } from '../config/env.ts';
import { config } from '../config/runtime.ts';
import { AppError } from './errors.ts';
import { logger } from './logger.ts';

/**
 * Where uploaded files live: an S3 bucket (the real thing, or the local fake in demo mode and
 * tests) or a plain folder. Keys are generated UUIDs, never a name a client sent.
 */
export interface FileStore {
  readonly kind: 's3' | 'folder';
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** The stored bytes, or null when nothing is stored under `key`. */
  get(key: string): Promise<Buffer | null>;
  delete(key: string): Promise<void>;
}

const KEY = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

function assertKey(key: string): void {
  if (!KEY.test(key)) throw new Error('file store keys are generated UUIDs');
}

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
}

export class S3FileStore implements FileStore {
  readonly kind = 's3' as const;
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(settings: S3Settings) {
    this.bucket = settings.bucket;
    this.client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      // Local fakes and most S3-compatible stores address buckets by path, not by host name.
      forcePathStyle: true,
      credentials:
        settings.accessKeyId && settings.secretAccessKey
          ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
          : undefined,
    });
  }

  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    assertKey(key);
    await this.client.send(
      new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: body, ContentType: contentType }),
    );
  }

  async get(key: string): Promise<Buffer | null> {
    assertKey(key);
    try {
      const object = await this.client.send(
        new GetObjectCommand({ Bucket: this.bucket, Key: key }),
      );
      if (!object.Body) return null;
      return Buffer.from(await object.Body.transformToByteArray());
    } catch (err) {
      if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey') return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    assertKey(key);
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
  }

  destroy(): void {
    this.client.destroy();
  }
}

/** Files in one folder, written to a temporary name first and renamed, so a reader never sees half a file. */
export class FolderFileStore implements FileStore {
  readonly kind = 'folder' as const;

  constructor(readonly dir: string) {}

  private pathOf(key: string): string {
    assertKey(key);
    return path.join(this.dir, key);
  }

  async put(key: string, body: Buffer): Promise<void> {
    const target = this.pathOf(key);
    await mkdir(this.dir, { recursive: true, mode: 0o700 });
    const temp = path.join(this.dir, `.${key}.${randomBytes(6).toString('hex')}.part`);
    try {
      await writeFile(temp, body, { mode: 0o600, flag: 'wx' });
      await rename(temp, target);
    } catch (err) {
      await rm(temp, { force: true });
      throw err;
    }
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await readFile(this.pathOf(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }
}

/** The folder used when no S3 endpoint is configured. */
export function uploadDir(env: Pick<Env, 'UPLOAD_DIR' | 'DATA_DIR'>): string {
  return path.resolve(env.UPLOAD_DIR ?? path.join(env.DATA_DIR, 'uploads'));
}

export function fileStoreFromEnv(env: Env): FileStore {
  if (env.S3_ENDPOINT) {
    return new S3FileStore({
      endpoint: env.S3_ENDPOINT,
      bucket: env.S3_BUCKET,
      region: env.S3_REGION,
      accessKeyId: env.S3_ACCESS_KEY_ID,
      secretAccessKey: env.S3_SECRET_ACCESS_KEY,
    });
  }
  return new FolderFileStore(uploadDir(env));
}

let chosen: FileStore | null = null;
let built: { env: Env; store: FileStore } | null = null;

/** Set at boot when the store is not the one the environment names (the demo's local S3 fake). */
export function setFileStore(store: FileStore | null): void {
  chosen = store;
}

/** The store this process uses: the one set at boot, or the one the configuration names. */
export function fileStore(): FileStore {
  if (chosen) return chosen;
  const env = config();
  if (!built || built.env !== env) built = { env, store: fileStoreFromEnv(env) };
  return built.store;
}

/**
 * The bytes stored under `key`, only if they still hash to the SHA-256 recorded at upload; null
 * when nothing is stored. Anyone who can write to the bucket or folder could otherwise swap a scan
 * for something else and have it served under the original's name and type.
 */
export async function readVerified(
  key: string,
  sha256: string,
  what: { entity: string; id: number },
): Promise<Buffer | null> {
  const bytes = await fileStore().get(key);
  if (!bytes) return null;
  const actual = createHash('sha256').update(bytes).digest();
  const expected = Buffer.from(sha256, 'hex');
  if (expected.length !== actual.length || !timingSafeEqual(actual, expected)) {
    logger.error(
      { ...what, storageKey: key, expected: sha256, actual: actual.toString('hex') },
      'stored file does not match the SHA-256 taken at upload; not served',
    );
    throw new AppError(
      500,
      'stored_file_altered',
      'The stored file no longer matches the fingerprint taken when it was uploaded, so it is not served. Tell whoever looks after the server; upload the file again if you have it.',
    );
  }
  return bytes;
}
