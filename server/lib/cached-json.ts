import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import type { Request, Response } from 'express';
import { onDatabaseClose } from '../db/index.ts';

/** A serialised answer and its ETag, made once and sent many times. */
export interface JsonBody {
  body: Buffer;
  etag: string;
  /** The body compressed, made on the first request that accepts each encoding. */
  encoded?: Partial<Record<Encoding, Promise<Buffer>>>;
}

type Encoding = 'br' | 'gzip';

const brotli = promisify(brotliCompress);
const gzipped = promisify(gzip);
// The compression middleware's own settings (brotli quality 4, gzip level 6): same bytes either way.
const ENCODERS: Record<Encoding, (body: Buffer) => Promise<Buffer>> = {
  br: (body) => brotli(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 4 } }),
  gzip: (body) => gzipped(body),
};
/** Below this the compression middleware would not compress either. */
const THRESHOLD = 1024;

/** The same weak ETag Express would compute for these bytes, so caching changes no header. */
function weakEtag(body: Buffer): string {
  const hash = createHash('sha1').update(body).digest('base64').substring(0, 27);
  return `W/"${body.length.toString(16)}-${hash}"`;
}

export function toJsonBody(value: unknown): JsonBody {
  const body = Buffer.from(JSON.stringify(value), 'utf8');
  return { body, etag: weakEtag(body) };
}

/**
 * Sends a prepared body as `res.json` would; a matching If-None-Match gets 304. A client that
 * accepts brotli or gzip gets the body compressed once per cache entry, not once per request.
 */
export async function sendJsonBody(req: Request, res: Response, json: JsonBody): Promise<void> {
  res.set('Content-Type', 'application/json; charset=utf-8');
  res.set('ETag', json.etag);
  res.vary('Accept-Encoding');
  // Without Accept-Encoding the compression middleware sends plain bytes; so do we.
  const encoding =
    json.body.length >= THRESHOLD && req.headers['accept-encoding']
      ? req.acceptsEncodings('br', 'gzip')
      : false;
  if (encoding !== 'br' && encoding !== 'gzip') {
    res.send(json.body);
    return;
  }
  json.encoded ??= {};
  json.encoded[encoding] ??= ENCODERS[encoding](json.body);
  const body = await json.encoded[encoding];
  res.set('Content-Encoding', encoding);
  res.send(body);
}

/**
 * Serialised answers per conversion, each valid for one value of the conversion's change counter
 * (migration 0009: triggers move it on every write to the rows the answer is made of). Read the
 * counter before the rows: rows read after it are at least as new as it, so an entry is never
 * older than its counter says. Requests that miss together share one build. Emptied when the
 * database closes, since another database reuses ids and counters.
 */
export class ConversionJsonCache {
  private readonly entries = new Map<number, { counter: number; value: Promise<JsonBody> }>();

  constructor(private readonly maxConversions = 32) {
    onDatabaseClose(() => this.entries.clear());
  }

  get(conversionId: number, counter: number, build: () => Promise<unknown>): Promise<JsonBody> {
    const hit = this.entries.get(conversionId);
    if (hit && hit.counter === counter) {
      // Most recently used last, so the oldest goes first when the cache is full.
      this.entries.delete(conversionId);
      this.entries.set(conversionId, hit);
      return hit.value;
    }
    const value = build().then(toJsonBody);
    // A request that read the counter before a write that another already cached: answer, keep the newer.
    if (hit && hit.counter > counter) return value;
    const entry = { counter, value };
    this.entries.delete(conversionId);
    this.entries.set(conversionId, entry);
    // A failed build is not kept.
    value.catch(() => {
      if (this.entries.get(conversionId) === entry) this.entries.delete(conversionId);
    });
    while (this.entries.size > this.maxConversions) {
      this.entries.delete(this.entries.keys().next().value!);
    }
    return value;
  }
}
