/**
 * The seal on a reviewer's decision (docs/decisions/0010-write-queue-and-seal.md): an Ed25519
 * signature over the revision's content hash, recomputed from its snapshot and findings, plus who
 * decided what and when. The private key lives outside the database, so whoever can write the
 * database file can change a revision and recompute its hash but cannot make a seal match.
 */
import {
  createHash,
  createPrivateKey,
  createPublicKey,
  sign,
  verify,
  type KeyObject,
} from 'node:crypto';
import canonicalize from 'canonicalize';

export interface SealedDecision {
  conversionId: number;
  number: number;
  /** SHA-256 of the canonical snapshot and findings, recomputed from the content. */
  contentHash: string;
  decision: 'signed_off' | 'changes_requested';
  reviewerId: number | null;
  reviewerName: string;
  /** ISO 8601, UTC, milliseconds. */
  decidedAt: string;
  submittedByName: string;
  submittedAt: string;
}

export interface SealKey {
  privateKey: KeyObject;
  publicKey: KeyObject;
  /** The raw 32-byte public key, base64. */
  publicKeyBase64: string;
  /** First 16 bytes of SHA-256 of the raw public key, hex in groups of four, for reading aloud. */
  fingerprint: string;
}

const cache = new Map<string, SealKey>();

export function sealKeyFrom(privatePem: string): SealKey {
  const known = cache.get(privatePem);
  if (known) return known;
  const privateKey = createPrivateKey(privatePem);
  if (privateKey.asymmetricKeyType !== 'ed25519') throw new Error('the seal key must be Ed25519');
  const publicKey = createPublicKey(privateKey);
  const raw = Buffer.from(publicKey.export({ format: 'jwk' }).x!, 'base64url');
  const fingerprint = createHash('sha256')
    .update(raw)
    .digest('hex')
    .slice(0, 32)
    .replace(/(.{4})(?!$)/g, '$1 ');
  const key = { privateKey, publicKey, publicKeyBase64: raw.toString('base64'), fingerprint };
  cache.set(privatePem, key);
  return key;
}

/** The exact bytes signed: RFC 8785 canonical JSON, versioned so the format can change later. */
function sealedBytes(decision: SealedDecision): Buffer {
  const text = canonicalize({ loomwrightSeal: 1, ...decision });
  if (text === undefined) throw new Error('the decision cannot be serialised');
  return Buffer.from(text, 'utf8');
}

/** The base64 Ed25519 signature of a decision. */
export function sealDecision(key: SealKey, decision: SealedDecision): string {
  return sign(null, sealedBytes(decision), key.privateKey).toString('base64');
}

export function sealMatches(key: SealKey, decision: SealedDecision, seal: string | null): boolean {
  if (!seal) return false;
  try {
    return verify(null, sealedBytes(decision), key.publicKey, Buffer.from(seal, 'base64'));
  } catch {
    return false;
  }
}
