import { createHash, randomBytes } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import { mkdir, rename, rm, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { Readable } from 'node:stream';
import { signatureProblem, type Credentials } from './s3-signature.ts';
import { S3_FULL_CODE, S3_READ_ONLY_CODE } from './storage-errors.ts';

export interface S3Fake {
  endpoint: string;
  port: number;
  /** Made up at start; every request must be signed with them. */
  credentials: Credentials;
  close: () => Promise<void>;
}

/** How the stand-in writes an object's bytes; tests swap it to simulate a full or read-only disk. */
export interface FakeDisk {
  writeFile(file: string, data: Buffer): Promise<void>;
}

const realDisk: FakeDisk = {
  writeFile: (file, data) => writeFile(file, data, { mode: 0o600, flag: 'wx' }),
};

/** The parts of s3rver's file system store that the safe write below uses. */
interface S3rverStore {
  getResourcePath(bucket: string, key: string, resource: string): string;
  putMetadata(bucket: string, key: string, metadata: unknown, md5: string): Promise<void>;
  putObject(object: S3rverObject): Promise<{ size: number; md5: string }>;
}

interface S3rverObject {
  bucket: string;
  key: string;
  content: Buffer | Readable;
  metadata: unknown;
}

type KoaMiddleware = (ctx: unknown, next: () => Promise<void>) => Promise<void>;

function readAll(stream: Readable): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    stream.on('data', (chunk: Buffer) => chunks.push(chunk));
    stream.on('error', reject);
    stream.on('end', () => resolve(Buffer.concat(chunks)));
  });
}

/**
 * s3rver 3.7 pipes an upload into a write stream that has no 'error' listener: a full disk there
 * is an uncaught exception that ends the whole process. This write takes its place: the bytes go
 * to a temporary file that is renamed into place only when they and the metadata are written, and
 * every failure rejects the request (and leaves nothing behind) instead of crashing.
 */
async function putObjectWhole(
  store: S3rverStore,
  object: S3rverObject,
  disk: FakeDisk,
): Promise<{ size: number; md5: string }> {
  const objectPath = store.getResourcePath(object.bucket, object.key, 'object');
  const dir = path.dirname(objectPath);
  await mkdir(dir, { recursive: true, mode: 0o700 });
  const content = Buffer.isBuffer(object.content) ? object.content : await readAll(object.content);
  const md5 = createHash('md5').update(content).digest('hex');
  // Not ending in "._S3rver_object", so a listing never shows it.
  const temp = path.join(dir, `.${randomBytes(8).toString('hex')}.part`);
  try {
    await disk.writeFile(temp, content);
    await store.putMetadata(object.bucket, object.key, object.metadata, md5);
    await rename(temp, objectPath);
  } catch (err) {
    await rm(temp, { force: true }).catch(() => undefined);
    throw err;
  }
  return { size: content.length, md5 };
}

const FULL = new Set(['ENOSPC', 'EDQUOT']);
const READ_ONLY = new Set(['EROFS', 'EACCES', 'EPERM']);

/**
 * A disk error inside the stand-in answered as an S3 error with its own code (507 full, 503
 * read-only) rather than s3rver's generic 500, so the app can tell the client what happened.
 */
function storageErrorsAsS3Errors(S3Error: S3ErrorClass): KoaMiddleware {
  return async (_ctx, next) => {
    try {
      await next();
    } catch (err) {
      const code = (err as { code?: unknown }).code;
      if (typeof code === 'string' && FULL.has(code)) {
        const e = new S3Error(S3_FULL_CODE, 'The storage behind this server is full.');
        e.status = 507;
        throw e;
      }
      if (typeof code === 'string' && READ_ONLY.has(code)) {
        const e = new S3Error(S3_READ_ONLY_CODE, 'The storage behind this server is read-only.');
        e.status = 503;
        throw e;
      }
      throw err;
    }
  };
}

type S3ErrorClass = new (code: string, message: string) => Error & { status: number };

/**
 * Refuses (403) every request not signed with `credentials`: s3rver alone answers anyone on the
 * machine. A signed request goes on without its Authorization header, which s3rver would only
 * check against its built-in key.
 */
function signedRequestsOnly(credentials: Credentials, S3Error: S3ErrorClass): KoaMiddleware {
  return async (ctx, next) => {
    const req = (ctx as { req: IncomingMessage }).req;
    const problem = signatureProblem(
      { method: req.method ?? 'GET', url: req.url ?? '/', headers: req.headers },
      credentials,
    );
    if (problem) throw new S3Error('AccessDenied', `Access Denied (${problem}).`);
    delete req.headers.authorization;
    await next();
  };
}

/** A key pair for one run of the stand-in, in the shape AWS keys take. */
function freshCredentials(): Credentials {
  return {
    accessKeyId: `LW${randomBytes(9).toString('hex').toUpperCase()}`,
    secretAccessKey: randomBytes(30).toString('base64url'),
  };
}

/**
 * A local S3-compatible server (s3rver) on 127.0.0.1 that keeps objects in `directory`, with
 * `bucket` created at start, answering only requests signed with the key pair it makes up at
 * start (`credentials`): demo mode and the tests store files through the real S3 SDK against
 * it. Loaded on demand so production never loads it.
 */
export async function startS3Fake(options: {
  directory: string;
  bucket: string;
  port?: number;
  /** Tests only: how object bytes are written. */
  disk?: FakeDisk;
}): Promise<S3Fake> {
  await mkdir(options.directory, { recursive: true, mode: 0o700 });
  const { default: S3rver } = await import('s3rver');
  const S3Error = createRequire(import.meta.url)('s3rver/lib/models/error') as S3ErrorClass;
  const server = new S3rver({
    address: '127.0.0.1',
    port: options.port ?? 0,
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket }],
  });
  const internals = server as unknown as { store: S3rverStore; middleware: KoaMiddleware[] };
  const store = internals.store;
  const disk = options.disk ?? realDisk;
  store.putObject = (object) => putObjectWhole(store, object, disk);
  const credentials = freshCredentials();
  internals.middleware.unshift(
    storageErrorsAsS3Errors(S3Error),
    signedRequestsOnly(credentials, S3Error),
  );
  const address = await server.run();
  return {
    endpoint: `http://127.0.0.1:${address.port}`,
    port: address.port,
    credentials,
    close: () => server.close(),
  };
}
