import { randomBytes } from 'node:crypto';
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
