/**
 * The check in front of the demo S3 stand-in: requests the S3 SDK signs with the stand-in's key
 * pass; anything unsigned, signed with another secret, stale or altered after signing does not.
 * The SDK signs for real here; its request never leaves the process.
 */
import { Readable } from 'node:stream';
import { PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { describe, expect, it } from 'vitest';
import { signatureProblem, type SignedRequest } from '#server/lib/s3-signature.ts';

const KEYS = {
  accessKeyId: 'LWTESTKEY0000000001',
  secretAccessKey: 'a-secret-for-this-test-only-0123456789',
};

/** What the SDK would send for a PUT of `key`, signed with `secretAccessKey`. */
async function signedPut(
  key: string,
  secretAccessKey = KEYS.secretAccessKey,
): Promise<SignedRequest> {
  let sent: SignedRequest | null = null;
  const client = new S3Client({
    endpoint: 'http://127.0.0.1:4568',
    region: 'us-east-1',
    forcePathStyle: true,
    maxAttempts: 1,
    credentials: { accessKeyId: KEYS.accessKeyId, secretAccessKey },
    requestHandler: {
      handle: async (req: {
        method: string;
        path: string;
        query?: Record<string, string>;
        headers: Record<string, string>;
      }) => {
        const query = new URLSearchParams(req.query ?? {}).toString();
        const headers = Object.fromEntries(
          Object.entries(req.headers).map(([k, v]) => [k.toLowerCase(), v]),
        );
        sent = { method: req.method, url: req.path + (query ? `?${query}` : ''), headers };
        return { response: { statusCode: 200, headers: {}, body: Readable.from([]) } };
      },
    },
  });
  await client
    .send(new PutObjectCommand({ Bucket: 'loomwright', Key: key, Body: Buffer.from('scan') }))
    .catch(() => undefined);
  client.destroy();
  if (!sent) throw new Error('the SDK sent nothing');
  return sent;
}

describe('the S3 stand-in’s signature check', () => {
  it('passes a request the SDK signed with the key pair', async () => {
    expect(
      signatureProblem(await signedPut('6f1c1a2e-8c1b-4c3a-9d7e-2b1f0a9c8d7e'), KEYS),
    ).toBeNull();
  });

  it('refuses an unsigned request, another secret, another access key and a stale one', async () => {
    const req = await signedPut('6f1c1a2e-8c1b-4c3a-9d7e-2b1f0a9c8d7e');
    const { authorization: _a, ...unsigned } = req.headers;
    expect(signatureProblem({ ...req, headers: unsigned }, KEYS)).toBe('unsigned request');
    expect(
      signatureProblem(await signedPut('6f1c1a2e-8c1b-4c3a-9d7e-2b1f0a9c8d7e', 'guessed'), KEYS),
    ).toBe('signature does not match');
    expect(signatureProblem(req, { ...KEYS, accessKeyId: 'SOMEONEELSE' })).toBe(
      'unknown access key',
    );
    expect(signatureProblem(req, KEYS, Date.now() + 16 * 60_000)).toBe(
      'request time too far from now',
    );
  });

  it('refuses a signed request sent to another key or with another payload hash', async () => {
    const req = await signedPut('6f1c1a2e-8c1b-4c3a-9d7e-2b1f0a9c8d7e');
    const otherKey = { ...req, url: req.url.replace('6f1c1a2e', '00000000') };
    expect(signatureProblem(otherKey, KEYS)).toBe('signature does not match');
    const otherBody = {
      ...req,
      headers: { ...req.headers, 'x-amz-content-sha256': '0'.repeat(64) },
    };
    expect(signatureProblem(otherBody, KEYS)).toBe('signature does not match');
  });
});
