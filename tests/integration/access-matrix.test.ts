/**
 * Deny by default (ASVS 8.2.1): every API route × {anonymous, each role}. A route missing from
 * this table fails the test, so a new route cannot ship without its access decided here.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '#shared/auth/roles.ts';
import { createTestContext, type TestContext } from '../helpers/test-app.ts';
import { listRoutes } from '../helpers/routes.ts';

const ALL: Role[] = [...ROLES];
const WRITERS: Role[] = ['builder', 'admin'];
const PUBLIC = 'public' as const;

/** Who may call each route; anyone else signed in gets 403, anonymous callers 401. */
const ACCESS: Record<string, Role[] | typeof PUBLIC> = {
  'GET /api/health': PUBLIC,
  'POST /api/auth/login': PUBLIC,
  'POST /api/auth/logout': ALL,
  'GET /api/auth/me': ALL,
  'POST /api/auth/password': ALL,
  'GET /api/workshop': ALL,
  'PATCH /api/workshop': ['admin'],
  'GET /api/users': ['admin'],
  'POST /api/users': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'GET /api/conversions': ALL,
  'POST /api/conversions': WRITERS,
  'GET /api/conversions/:id': ALL,
  'PATCH /api/conversions/:id': WRITERS,
  'GET /api/conversions/:id/connectors': ALL,
  'POST /api/conversions/:id/connectors': WRITERS,
  'GET /api/conversions/:id/pins': ALL,
  'POST /api/conversions/:id/pins/bulk': WRITERS,
  'POST /api/conversions/:id/pins/batch': WRITERS,
  'PATCH /api/connectors/:id': WRITERS,
  'DELETE /api/connectors/:id': WRITERS,
  'PATCH /api/pins/:id': WRITERS,
  // Pinout import and export, the library, reference scans.
  'POST /api/connectors/:id/import': WRITERS,
  'POST /api/conversions/:id/import': WRITERS,
  'GET /api/conversions/:id/pins.csv': ALL,
  'GET /api/conversions/:id/wires': ALL,
  'POST /api/conversions/:id/wires': WRITERS,
  'GET /api/conversions/:id/wires.csv': ALL,
  'POST /api/conversions/:id/wires/import': WRITERS,
  'PATCH /api/wires/:id': WRITERS,
  'DELETE /api/wires/:id': WRITERS,
  'GET /api/conversions/:id/splices': ALL,
  'POST /api/conversions/:id/splices': WRITERS,
  'PATCH /api/conversions/:id/splices/:itemId': WRITERS,
  'DELETE /api/conversions/:id/splices/:itemId': WRITERS,
  'GET /api/conversions/:id/ground-points': ALL,
  'POST /api/conversions/:id/ground-points': WRITERS,
  'PATCH /api/conversions/:id/ground-points/:itemId': WRITERS,
  'DELETE /api/conversions/:id/ground-points/:itemId': WRITERS,
  'GET /api/conversions/:id/boxes': ALL,
  'POST /api/conversions/:id/boxes': WRITERS,
  'PATCH /api/conversions/:id/boxes/:itemId': WRITERS,
  'GET /api/conversions/:id/circuits/feed/:refId.svg': ALL,
  'GET /api/conversions/:id/circuits/pin/:refId.svg': ALL,
  'GET /api/pinouts/template.csv': ALL,
  'GET /api/library/templates': ALL,
  'GET /api/library/templates/:id': ALL,
  'POST /api/library/templates': WRITERS,
  'DELETE /api/library/templates/:id': WRITERS,
  'POST /api/conversions/:id/connectors/from-template': WRITERS,
  'GET /api/connectors/:id/attachments': ALL,
  'POST /api/connectors/:id/attachments': WRITERS,
  'GET /api/attachments/:id': ALL,
  'DELETE /api/attachments/:id': WRITERS,
  'GET /api/conversions/:id/feeds': ALL,
  'POST /api/conversions/:id/feeds': WRITERS,
  'GET /api/conversions/:id/feeds/:feedId': ALL,
  'PATCH /api/conversions/:id/feeds/:feedId': WRITERS,
  'DELETE /api/conversions/:id/feeds/:feedId': WRITERS,
  'POST /api/conversions/:id/checks': ALL,
  'GET /api/conversions/:id/worksheet.pdf': ALL,
  'GET /api/conversions/:id/revisions/:number/worksheet.pdf': ALL,
  'POST /api/calc/run': ALL,
  'POST /api/auth/set-password': PUBLIC,
  'GET /api/conversions/:id/revisions': ALL,
  'POST /api/conversions/:id/revisions': WRITERS,
  'GET /api/conversions/:id/revisions/:number': ALL,
  'PUT /api/conversions/:id/revisions/:number': ALL,
  'PATCH /api/conversions/:id/revisions/:number': ALL,
  'DELETE /api/conversions/:id/revisions/:number': ALL,
  'GET /api/conversions/:id/revisions/:number/verify': ALL,
  'POST /api/conversions/:id/revisions/:number/sign-off': ['reviewer'],
  'POST /api/conversions/:id/revisions/:number/send-back': ['reviewer'],
  'POST /api/conversions/:id/revisions/:number/comments': ['reviewer', 'builder', 'admin'],
  'POST /api/conversions/:id/revisions/:number/comments/:commentId/answered': WRITERS,
  'GET /api/conversions/:id/audit': ['admin', 'reviewer', 'builder'],
  'GET /api/admin/outbox': ['admin'],
  'GET /api/conversions/:id/bench': ALL,
  'GET /api/conversions/:id/revisions/:number/bench': ALL,
  'GET /api/conversions/:id/revisions/:number/test-plan': ALL,
  'PUT /api/conversions/:id/revisions/:number/bench/:key': ['technician', 'admin'],
  'POST /api/conversions/:id/revisions/:number/bench/:key/photos': ['technician', 'admin'],
  'GET /api/bench-photos/:id': ALL,
};

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(() => ctx.close());

/** Fill every :param with an id that exists nowhere, so an allowed call ends in 400/404, never a change. */
const concrete = (path: string) => path.replace(/:[A-Za-z]+/g, '999999');

describe('access matrix', () => {
  it('covers every route the app has', () => {
    const routes = listRoutes(ctx.app);
    expect(routes.filter((r) => !(r in ACCESS))).toEqual([]);
    expect(Object.keys(ACCESS).filter((r) => !routes.includes(r))).toEqual([]);
  });

  for (const [route, allowed] of Object.entries(ACCESS)) {
    if (allowed === PUBLIC || route === 'POST /api/auth/logout') continue;
    const [method, path] = route.split(' ') as [string, string];
    it(`${route}: anonymous 401, ${allowed.join('/')} allowed, others 403`, async () => {
      const call = (auth?: string) => {
        const req = request(ctx.app)[method.toLowerCase() as 'get'](concrete(path));
        if (auth) req.set('Authorization', auth);
        return method === 'GET' ? req : req.send({});
      };
      expect((await call()).status).toBe(401);
      for (const role of ALL) {
        const res = await call(await ctx.authFor(role));
        if (allowed.includes(role)) {
          expect([401, 403], `${role} should pass the guard`).not.toContain(res.status);
        } else {
          expect(res.status, `${role} should get 403`).toBe(403);
        }
      }
    });
  }
});
