/**
 * The content hash of a revision: SHA-256 over the RFC 8785 canonical JSON of its snapshot and
 * findings, so the same content always hashes the same, whatever order keys were written in.
 */
import canonicalize from 'canonicalize';
import type { Finding } from '../../schemas/checks.schema.ts';
import type { ConversionSnapshot } from '../../schemas/snapshot.schema.ts';

export function canonicalRevisionContent(
  snapshot: ConversionSnapshot,
  findings: Finding[],
): string {
  const text = canonicalize({ snapshot, findings });
  if (text === undefined) throw new Error('revision content cannot be serialised');
  return text;
}

/** Hex SHA-256 of a string's UTF-8 bytes, with the platform's Web Crypto (Node and browsers). */
export async function sha256Hex(text: string): Promise<string> {
  const digest = await globalThis.crypto.subtle.digest('SHA-256', new TextEncoder().encode(text));
  return [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
}

export async function revisionHash(
  snapshot: ConversionSnapshot,
  findings: Finding[],
): Promise<string> {
  return sha256Hex(canonicalRevisionContent(snapshot, findings));
}
