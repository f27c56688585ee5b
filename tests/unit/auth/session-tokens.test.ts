import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { loadEnv } from '#server/config/env.ts';
import { setConfig } from '#server/config/runtime.ts';
import { signSessionToken, verifySessionToken } from '#server/modules/auth/tokens.ts';

const dir = mkdtempSync(path.join(tmpdir(), 'lw-tokens-'));
const env = (secret: string) =>
  loadEnv({ DATABASE_PATH: path.join(dir, 'db.sqlite'), JWT_SECRET: secret, SESSION_HOURS: '1' });

beforeAll(() => setConfig(env('a'.repeat(43))));
afterEach(() => vi.useRealTimers());
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('session tokens verified once per token', () => {
  it('stop being accepted when they expire, though verified before', () => {
    vi.useFakeTimers({ now: new Date('2026-03-01T10:00:00Z') });
    const token = signSessionToken(7, 2);
    expect(verifySessionToken(token)).toEqual({ sub: '7', tv: 2 });
    vi.setSystemTime(new Date('2026-03-01T10:59:59Z'));
    expect(verifySessionToken(token)).toEqual({ sub: '7', tv: 2 });
    vi.setSystemTime(new Date('2026-03-01T11:00:00Z'));
    expect(verifySessionToken(token)).toBeNull();
  });

  it('are verified afresh under a new secret, and a changed signature is refused', () => {
    const token = signSessionToken(8, 0);
    expect(verifySessionToken(token)).toEqual({ sub: '8', tv: 0 });
    const [head, body, signature] = token.split('.');
    const flipped = signature!.startsWith('A')
      ? `B${signature!.slice(1)}`
      : `A${signature!.slice(1)}`;
    expect(verifySessionToken(`${head}.${body}.${flipped}`)).toBeNull();
    setConfig(env('b'.repeat(43)));
    expect(verifySessionToken(token)).toBeNull();
  });
});
