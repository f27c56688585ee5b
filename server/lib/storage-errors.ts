import { AppError } from './errors.ts';

/** Errno and SQLite codes that mean the disk (or the user's quota on it) has no room left. */
const FULL = new Set(['ENOSPC', 'EDQUOT', 'SQLITE_FULL']);
/** Codes that mean storage refuses writes: mounted read-only, or permissions taken away. */
const READ_ONLY = new Set(['EROFS', 'EACCES', 'EPERM', 'SQLITE_READONLY', 'SQLITE_CANTOPEN']);
/** Error codes our S3 stand-in sends for the same two conditions (server/lib/s3-fake.ts). */
export const S3_FULL_CODE = 'InsufficientStorage';
export const S3_READ_ONLY_CODE = 'StorageReadOnly';

interface Coded {
  code?: unknown;
  name?: unknown;
  original?: { code?: unknown };
  parent?: { code?: unknown };
  $metadata?: { httpStatusCode?: number };
}

function codesOf(err: unknown): string[] {
  const e = err as Coded | null;
  if (!e || typeof e !== 'object') return [];
  return [e.code, e.original?.code, e.parent?.code, e.name].filter(
    (c): c is string => typeof c === 'string',
  );
}

export const storageFull = () =>
  new AppError(
    507,
    'storage_full',
    'The server has run out of storage space. Nothing was saved; tell whoever looks after the server.',
  );

export const storageReadOnly = () =>
  new AppError(
    503,
    'storage_read_only',
    'The server cannot write to its storage right now. Nothing was saved; try again later or tell whoever looks after the server.',
    undefined,
    { 'Retry-After': '60' },
  );

/**
 * A storage failure (disk full, read-only) from the file system, SQLite or the S3 store as the
 * answer the client gets: 507 for a full disk, 503 for storage that refuses writes. Anything else:
 * null, and the caller decides.
 */
export function storageFailure(err: unknown): AppError | null {
  const codes = codesOf(err);
  if (codes.some((c) => FULL.has(c) || c === S3_FULL_CODE)) return storageFull();
  if (codes.some((c) => READ_ONLY.has(c) || c === S3_READ_ONLY_CODE)) return storageReadOnly();
  const status = (err as Coded | null)?.$metadata?.httpStatusCode;
  if (status === 507) return storageFull();
  return null;
}
