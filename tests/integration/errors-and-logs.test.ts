import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { Conversion } from '#server/db/models/index.ts';
import { createTestContext, login, TEST_PASSWORD, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({ LOG_LEVEL: 'info' });
});
afterAll(() => ctx.close());

/** Collects what the logger writes while `work` runs. */
async function captureLogs(work: () => Promise<unknown>): Promise<string> {
  const lines: string[] = [];
  const spy = vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
    lines.push(String(chunk));
    return true;
  });
  try {
    await work();
  } finally {
    spy.mockRestore();
  }
  return lines.join('');
}

describe('errors', () => {
  it('answers a failing database query with a plain 500: no SQL, stack or path', async () => {
    const spy = vi.spyOn(Conversion, 'findAll').mockRejectedValueOnce(
      Object.assign(new Error('SQLITE_ERROR: no such table: conversions'), {
        stack: 'Error\n    at /work/main/server/x.ts:1:1',
      }),
    );
    try {
      const res = await request(ctx.app)
        .get('/api/conversions')
        .set('Authorization', await ctx.authFor('builder'));
      expect(res.status).toBe(500);
      expect(res.body).toEqual({
        error: {
          code: 'internal',
          message: 'Something went wrong on the server. It has been logged.',
        },
        requestId: expect.stringMatching(/^[0-9a-f-]{36}$/),
      });
      expect(JSON.stringify(res.body)).not.toMatch(/SQLITE|server\/|\.ts|at /);
    } finally {
      spy.mockRestore();
    }
  });

  it('refuses a body over 100 kB with 413', async () => {
    const res = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', await ctx.authFor('builder'))
      .send({
        name: 'x'.repeat(120_000),
        donorEngine: 'x',
        receivingVehicle: 'x',
        systemVoltage: 12,
      });
    expect(res.status).toBe(413);
  });
});

describe('logs', () => {
  it('log sign-ins as one JSON line each, with no password or token, even for a hostile e-mail', async () => {
    let token = '';
    const out = await captureLogs(async () => {
      const ok = await login(ctx.app, 'builder@example.com');
      token = ok.body.token;
      await login(ctx.app, 'a\nFAKE {"level":30,"msg":"login succeeded"}', 'not-the-password');
      await request(ctx.app).get('/api/conversions').set('Authorization', `Bearer ${token}`);
    });
    const lines = out.split('\n').filter(Boolean);
    for (const line of lines) expect(() => JSON.parse(line)).not.toThrow();
    expect(lines.filter((l) => JSON.parse(l).msg === 'login failed')).toHaveLength(1);
    expect(lines.filter((l) => JSON.parse(l).msg === 'login succeeded')).toHaveLength(1);
    expect(out).not.toContain(TEST_PASSWORD);
    expect(out).not.toContain('not-the-password');
    expect(out).not.toContain(token);
    expect(out).not.toMatch(/eyJ/);
    const request_ = lines
      .map((l) => JSON.parse(l))
      .find((l) => l.msg === 'request' && l.path === '/api/conversions');
    expect(request_).toMatchObject({ method: 'GET', status: 200, userId: ctx.demo.users.builder });
    expect(request_.time).toMatch(/Z$/);
  });
});
