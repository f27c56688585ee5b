import http from 'node:http';
import type { AddressInfo } from 'node:net';
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '#server/app.ts';
import { User } from '#server/db/models/index.ts';
import { createTestContext, login, TEST_PASSWORD, type TestContext } from '../helpers/test-app.ts';

let ctx: TestContext;
beforeAll(async () => {
  // This file signs in many times; the limit itself is tested on a separate app below.
  ctx = await createTestContext({ LOGIN_LIMIT_PER_MINUTE: '100' });
});
afterAll(() => ctx.close());

describe('sign-in', () => {
  it('answers a token and the user, and sets an httpOnly SameSite cookie', async () => {
    const res = await login(ctx.app, 'builder@example.com');
    expect(res.status).toBe(200);
    expect(res.body.token).toMatch(/^eyJ/);
    expect(res.body.user).toMatchObject({
      email: 'builder@example.com',
      name: 'Ivo Brandt',
      role: 'builder',
    });
    expect(Object.keys(res.body.user).sort()).toEqual(
      ['email', 'id', 'name', 'role', 'workshopId', 'workshopName'].sort(),
    );
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/lw_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
  });

  it('accepts the cookie as well as the bearer header', async () => {
    const res = await login(ctx.app, 'tech@example.com');
    const cookie = String(res.headers['set-cookie']).split(';')[0]!;
    const me = await request(ctx.app).get('/api/auth/me').set('Cookie', cookie);
    expect(me.status).toBe(200);
    expect(me.body.user.role).toBe('technician');
    const viaBearer = await request(ctx.app)
      .get('/api/auth/me')
      .set('Authorization', `Bearer ${res.body.token}`);
    expect(viaBearer.body.user.email).toBe('tech@example.com');
  });

  it('answers an unknown e-mail and a wrong password identically', async () => {
    const unknown = await login(ctx.app, 'nobody@example.com', 'whatever-password');
    const wrong = await login(ctx.app, 'reviewer@example.com', 'not-the-password');
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body.error).toEqual(wrong.body.error);
    expect(unknown.body.error.message).toBe('E-mail or password is not right.');
  });

  it('takes about as long for an unknown user as for a wrong password (dummy hash compare)', async () => {
    const time = async (email: string) => {
      const started = performance.now();
      await login(ctx.app, email, 'not-the-password');
      return performance.now() - started;
    };
    await time('admin@example.com'); // warm the dummy hash
    const unknown: number[] = [];
    const wrong: number[] = [];
    for (let i = 0; i < 3; i++) {
      unknown.push(await time(`ghost${i}@example.com`));
      wrong.push(await time('admin@example.com'));
    }
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[1]!;
    // Both medians are bcrypt compares at the same cost; a missing compare would be ~100x faster.
    expect(median(unknown)).toBeGreaterThan(median(wrong) * 0.5);
  });

  it('names the missing field on a bad body', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ password: 'x' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.details).toEqual([expect.objectContaining({ field: 'email' })]);
    const extra = await request(ctx.app)
      .post('/api/auth/login')
      .send({ email: 'a@example.com', password: 'x', role: 'admin' });
    expect(extra.status).toBe(400);
    expect(extra.body.error.message).toMatch(/role|unrecognized/i);
  });

  it('refuses a text/plain write (cross-site form) with 415', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/login')
      .set('Content-Type', 'text/plain')
      .send('{"email":"builder@example.com","password":"loomwright-demo"}');
    expect(res.status).toBe(415);
    expect(res.body.error.code).toBe('unsupported_media_type');
  });

  it('answers malformed JSON with 400, not 500', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });
});

describe('sessions', () => {
  it('refuses anonymous requests with 401', async () => {
    const res = await request(ctx.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('refuses alg:none, a wrong key, another issuer and an expired token', async () => {
    const user = await User.findByPk(ctx.demo.users.builder!);
    const claims = { sub: String(user!.id), tv: user!.tokenVersion };
    const none = jwt.sign(claims, '', {
      algorithm: 'none',
      issuer: 'loomwright',
      audience: 'loomwright-api',
    });
    const wrongKey = jwt.sign(claims, 'x'.repeat(64), {
      algorithm: 'HS256',
      issuer: 'loomwright',
      audience: 'loomwright-api',
    });
    const otherIssuer = jwt.sign(claims, ctx.env.JWT_SECRET, {
      algorithm: 'HS256',
      issuer: 'else',
      audience: 'loomwright-api',
    });
    const expired = jwt.sign(
      { ...claims, exp: Math.floor(Date.now() / 1000) - 10 },
      ctx.env.JWT_SECRET,
      {
        algorithm: 'HS256',
        issuer: 'loomwright',
        audience: 'loomwright-api',
      },
    );
    for (const token of [none, wrongKey, otherIssuer, expired]) {
      const res = await request(ctx.app)
        .get('/api/auth/me')
        .set('Authorization', `Bearer ${token}`);
      expect(res.status).toBe(401);
    }
  });

  it('revokes the token on sign-out', async () => {
    const { body } = await login(ctx.app, 'reviewer@example.com');
    const auth = `Bearer ${body.token}`;
    expect((await request(ctx.app).get('/api/auth/me').set('Authorization', auth)).status).toBe(
      200,
    );
    expect(
      (await request(ctx.app).post('/api/auth/logout').set('Authorization', auth)).status,
    ).toBe(204);
    expect((await request(ctx.app).get('/api/auth/me').set('Authorization', auth)).status).toBe(
      401,
    );
  });

  it('applies a demotion at once: the old token gets 403 on a builder route', async () => {
    const admin = await ctx.authFor('admin');
    const created = await request(ctx.app).post('/api/users').set('Authorization', admin).send({
      email: 'temp.builder@example.com',
      name: 'Temp Builder',
      role: 'builder',
      password: 'a long enough phrase',
    });
    expect(created.status).toBe(201);
    const { body } = await login(ctx.app, 'temp.builder@example.com', 'a long enough phrase');
    const before = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', `Bearer ${body.token}`)
      .send({ name: 'x', donorEngine: 'KT-20', receivingVehicle: 'Corran 100', systemVoltage: 12 });
    expect(before.status).toBe(201);
    await request(ctx.app)
      .patch(`/api/users/${created.body.user.id}`)
      .set('Authorization', admin)
      .send({ role: 'technician' })
      .expect(200);
    // The same token, unchanged, now carries the technician's rights: 403 on a builder route at
    // once, while reading still works.
    const after = await request(ctx.app)
      .post('/api/conversions')
      .set('Authorization', `Bearer ${body.token}`)
      .send({ name: 'y', donorEngine: 'KT-20', receivingVehicle: 'Corran 100', systemVoltage: 12 });
    expect(after.status).toBe(403);
    const read = await request(ctx.app)
      .get('/api/conversions')
      .set('Authorization', `Bearer ${body.token}`);
    expect(read.status).toBe(200);
  });

  it('refuses a role read from the token alone: the database role decides', async () => {
    // Change the role directly in the database without bumping the token version.
    const user = await User.findOne({ where: { email: 'builder@example.com' } });
    const token = await ctx.tokenFor('builder');
    await User.update({ role: 'technician' }, { where: { id: user!.id } });
    try {
      const res = await request(ctx.app)
        .post('/api/conversions')
        .set('Authorization', `Bearer ${token}`)
        .send({
          name: 'z',
          donorEngine: 'KT-20',
          receivingVehicle: 'Corran 100',
          systemVoltage: 12,
        });
      expect(res.status).toBe(403);
    } finally {
      await User.update({ role: 'builder' }, { where: { id: user!.id } });
    }
  });
});

describe('passwords', () => {
  it('refuses a weak, a common and an over-long password with 422; accepts a 64-character one', async () => {
    const { body } = await login(ctx.app, 'admin@example.com');
    const auth = `Bearer ${body.token}`;
    const change = (newPassword: string) =>
      request(ctx.app)
        .post('/api/auth/password')
        .set('Authorization', auth)
        .send({ currentPassword: TEST_PASSWORD, newPassword });
    expect((await change('short')).status).toBe(422);
    expect((await change('password123')).status).toBe(422);
    const tooLong = await change('é'.repeat(37)); // 74 UTF-8 bytes
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.message).toMatch(/72 bytes/);
    const ok = await change('k'.repeat(40) + 'harrow-lane-2026-bench!!');
    expect(ok.status).toBe(200);
    // The old token is revoked; the answer carries a new one.
    expect((await request(ctx.app).get('/api/auth/me').set('Authorization', auth)).status).toBe(
      401,
    );
    expect(
      (await request(ctx.app).get('/api/auth/me').set('Authorization', `Bearer ${ok.body.token}`))
        .status,
    ).toBe(200);
    const stored = await User.findOne({ where: { email: 'admin@example.com' } });
    expect(stored!.passwordHash).toMatch(/^\$2[aby]\$1\d\$/);
    // Put it back for the other tests.
    await request(ctx.app)
      .post('/api/auth/password')
      .set('Authorization', `Bearer ${ok.body.token}`)
      .send({
        currentPassword: 'k'.repeat(40) + 'harrow-lane-2026-bench!!',
        newPassword: TEST_PASSWORD,
      })
      .expect(200);
  });

  it('refuses a wrong current password', async () => {
    const res = await request(ctx.app)
      .post('/api/auth/password')
      .set('Authorization', await ctx.authFor('technician'))
      .send({ currentPassword: 'not it at all', newPassword: 'a perfectly fine phrase' });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].field).toBe('currentPassword');
  });
});

describe('platform', () => {
  it('answers /api/health', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it('answers an unknown /api route with 404 JSON, signed in or not', async () => {
    const anon = await request(ctx.app).get('/api/no-such-thing');
    expect(anon.status).toBe(404);
    expect(anon.body.error.code).toBe('not_found');
    const signedIn = await request(ctx.app)
      .delete('/api/conversions/1/nope')
      .set('Authorization', await ctx.authFor('admin'));
    expect(signedIn.status).toBe(404);
  });

  it('sends the security headers and hides the framework', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['content-security-policy']).toMatch(/frame-ancestors 'none'/);
    expect(res.headers['strict-transport-security']).toMatch(/max-age=31536000/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe('sign-in rate limit', () => {
  it('answers the 11th failed sign-in in a minute with 429 and Retry-After, whatever X-Forwarded-For says', async () => {
    const limited = await createLimitedServer();
    try {
      const statuses: number[] = [];
      let last: { status: number; headers: http.IncomingHttpHeaders; body: string } | null = null;
      for (let i = 0; i < 11; i++) {
        last = await post(
          limited.port,
          '/api/auth/login',
          { email: `x${i}@example.com`, password: 'wrong-password' },
          {
            'X-Forwarded-For': `203.0.113.${i}`,
          },
        );
        statuses.push(last.status);
      }
      expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
      expect(statuses[10]).toBe(429);
      expect(Number(last!.headers['retry-after'])).toBeGreaterThan(0);
      expect(JSON.parse(last!.body).error.code).toBe('rate_limited');
      // Another address is not affected (127.0.0.2 is loopback too).
      const other = await post(
        limited.port,
        '/api/auth/login',
        { email: 'builder@example.com', password: TEST_PASSWORD },
        {},
        '127.0.0.2',
      );
      expect(other.status).toBe(200);
    } finally {
      limited.server.close();
    }
  });
});

async function createLimitedServer() {
  // A fresh app: its limiters have not counted this file's other failed sign-ins.
  const server = http.createServer(createApp({ env: { ...ctx.env, LOGIN_LIMIT_PER_MINUTE: 10 } }));
  await new Promise<void>((resolve) => server.listen(0, '0.0.0.0', resolve));
  return { server, port: (server.address() as AddressInfo).port };
}

function post(
  port: number,
  path: string,
  body: unknown,
  headers: Record<string, string>,
  localAddress = '127.0.0.1',
): Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }> {
  return new Promise((resolve, reject) => {
    const data = JSON.stringify(body);
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        path,
        method: 'POST',
        localAddress,
        headers: {
          'Content-Type': 'application/json',
          'Content-Length': Buffer.byteLength(data),
          ...headers,
        },
      },
      (res) => {
        let text = '';
        res.on('data', (chunk) => (text += chunk));
        res.on('end', () => resolve({ status: res.statusCode!, headers: res.headers, body: text }));
      },
    );
    req.on('error', reject);
    req.end(data);
  });
}
