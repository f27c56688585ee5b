import { createHash, createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Checks an AWS Signature Version 4 `Authorization` header, as the S3 SDK sends it, against one
 * key pair. The local S3 stand-in (s3rver 3.7) accepts unsigned requests and takes any V4
 * signature on trust; this check is what makes its generated credentials mean something.
 * The algorithm: docs.aws.amazon.com "Create a signed AWS API request" (canonical request,
 * string to sign, HMAC-SHA256 key chain). S3 signs the path as sent, not encoded a second time.
 */
export interface SignedRequest {
  method: string;
  /** The request target as received: path and query string, still percent-encoded. */
  url: string;
  /** Header names in lower case, as Node gives them. */
  headers: Record<string, string | string[] | undefined>;
}

export interface Credentials {
  accessKeyId: string;
  secretAccessKey: string;
}

/** How far a request's x-amz-date may be from now (AWS allows 15 minutes). */
const MAX_SKEW_MS = 15 * 60 * 1000;
const AUTH =
  /^AWS4-HMAC-SHA256 Credential=([^/,\s]+)\/(\d{8})\/([^/,\s]+)\/([^/,\s]+)\/aws4_request,\s*SignedHeaders=([a-z0-9;-]+),\s*Signature=([0-9a-f]{64})$/;
const AMZ_DATE = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/;

const sha256Hex = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');
const hmac = (key: Buffer | string, text: string) =>
  createHmac('sha256', key).update(text, 'utf8').digest();

/** encodeURIComponent plus the characters RFC 3986 reserves that it leaves alone. */
const rfc3986 = (s: string) =>
  encodeURIComponent(s).replace(
    /[!'()*]/g,
    (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`,
  );

function safeDecode(s: string): string {
  try {
    return decodeURIComponent(s.replace(/\+/g, '%20'));
  } catch {
    return s;
  }
}

function canonicalQuery(query: string): string {
  if (!query) return '';
  return query
    .split('&')
    .filter(Boolean)
    .map((pair) => {
      const at = pair.indexOf('=');
      const key = at < 0 ? pair : pair.slice(0, at);
      const value = at < 0 ? '' : pair.slice(at + 1);
      return [rfc3986(safeDecode(key)), rfc3986(safeDecode(value))] as const;
    })
    .sort(([ka, va], [kb, vb]) => (ka < kb ? -1 : ka > kb ? 1 : va < vb ? -1 : va > vb ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
}

function headerValue(value: string | string[] | undefined): string {
  const joined = Array.isArray(value) ? value.join(',') : (value ?? '');
  return joined.trim().replace(/\s+/g, ' ');
}

/** Why the request is refused, or null when it is signed with `credentials` and fresh. */
export function signatureProblem(
  req: SignedRequest,
  credentials: Credentials,
  now = Date.now(),
): string | null {
  const auth = headerValue(req.headers.authorization);
  if (!auth) return 'unsigned request';
  const m = AUTH.exec(auth);
  if (!m) return 'not an AWS4-HMAC-SHA256 signature';
  const [, accessKeyId, day, region, service, signedHeaderList, signature] = m;
  if (accessKeyId !== credentials.accessKeyId) return 'unknown access key';
  const amzDate = headerValue(req.headers['x-amz-date']);
  const d = AMZ_DATE.exec(amzDate);
  if (!d || amzDate.slice(0, 8) !== day) return 'missing or mismatched x-amz-date';
  const at = Date.UTC(+d[1]!, +d[2]! - 1, +d[3]!, +d[4]!, +d[5]!, +d[6]!);
  if (Math.abs(now - at) > MAX_SKEW_MS) return 'request time too far from now';
  const signedHeaders = signedHeaderList!.split(';');
  for (const required of ['host', 'x-amz-date', 'x-amz-content-sha256']) {
    if (!signedHeaders.includes(required)) return `${required} is not signed`;
  }
  const queryAt = req.url.indexOf('?');
  const pathPart = queryAt < 0 ? req.url : req.url.slice(0, queryAt);
  const queryPart = queryAt < 0 ? '' : req.url.slice(queryAt + 1);
  const canonicalRequest = [
    req.method.toUpperCase(),
    pathPart || '/',
    canonicalQuery(queryPart),
    signedHeaders.map((h) => `${h}:${headerValue(req.headers[h])}\n`).join(''),
    signedHeaderList,
    headerValue(req.headers['x-amz-content-sha256']),
  ].join('\n');
  const scope = `${day}/${region}/${service}/aws4_request`;
  const stringToSign = ['AWS4-HMAC-SHA256', amzDate, scope, sha256Hex(canonicalRequest)].join('\n');
  let key = hmac(`AWS4${credentials.secretAccessKey}`, day!);
  for (const part of [region!, service!, 'aws4_request']) key = hmac(key, part);
  const expected = hmac(key, stringToSign);
  const given = Buffer.from(signature!, 'hex');
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) {
    return 'signature does not match';
  }
  return null;
}
