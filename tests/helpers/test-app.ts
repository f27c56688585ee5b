import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import pg from 'pg';
import request from 'supertest';
import type { Role } from '#shared/auth/roles.ts';
import { createApp } from '#server/app.ts';
import { loadEnv, type Env } from '#server/config/env.ts';
import { closeDatabase, connectDatabase } from '#server/db/index.ts';
import { User } from '#server/db/models/index.ts';
import { signSessionToken } from '#server/modules/auth/tokens.ts';
import { seedDemo, type DemoSeedResult } from '../../seeds/seed-demo.ts';
import { DEMO_USERS } from '../../seeds/demo-data.ts';

export const TEST_PASSWORD = 'loomwright-demo';

/**
 * `npm run test:pg` sets TEST_DATABASE_URL to a PostgreSQL server (any database on it, used to
 * create others): each test context then gets a database of its own there, dropped at close.
 */
export const TEST_DATABASE_URL = process.env.TEST_DATABASE_URL;
/** The tests run against PostgreSQL: SQLite's own checks (pragmas, the file) do not apply. */
export const onPostgres = Boolean(TEST_DATABASE_URL);

/** A fresh, empty PostgreSQL database for one test context; answers its URL and its dropper. */
export async function createPostgresDatabase(
  serverUrl: string,
): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `lw_test_${process.pid}_${randomBytes(4).toString('hex')}`;
  const admin = async (sql: string) => {
    const client = new pg.Client({ connectionString: serverUrl });
    await client.connect();
    try {
      await client.query(sql);
    } finally {
      await client.end();
    }
  };
  // Byte order for text, as SQLite's default collation sorts it.
  await admin(`CREATE DATABASE ${name} TEMPLATE template0 ENCODING 'UTF8' LOCALE 'C'`);
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    drop: () => admin(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`),
  };
}

export interface TestContext {
  app: Express;
  env: Env;
  demo: DemoSeedResult;
  databasePath: string;
  /** A valid session token for the demo user holding `role`, signed without a login round trip. */
  tokenFor: (role: Role) => Promise<string>;
  /** `Authorization` header value for the demo user holding `role`. */
  authFor: (role: Role) => Promise<string>;
  emailFor: (role: Role) => string;
  close: () => Promise<void>;
}

/**
 * A fresh database in a temporary folder, migrated and seeded with the demo workshop, and the app
 * built on it (no port). One per test file: models are bound to one database per process.
 */
export async function createTestContext(
  overrides: Record<string, string> = {},
): Promise<TestContext> {
  const dir = mkdtempSync(path.join(tmpdir(), 'loomwright-test-'));
  const databasePath = path.join(dir, 'test.sqlite');
  const postgres = TEST_DATABASE_URL ? await createPostgresDatabase(TEST_DATABASE_URL) : null;
  const env = loadEnv({
    NODE_ENV: 'test',
    DATABASE_PATH: databasePath,
    JWT_SECRET: randomBytes(32).toString('base64url'),
    BCRYPT_COST: '10',
    LOG_LEVEL: 'silent',
    ...(postgres ? { DATABASE_URL: postgres.url } : {}),
    ...overrides,
  });
  const sequelize = await connectDatabase(postgres ? postgres.url : databasePath);
  const demo = await seedDemo(sequelize, {
    password: TEST_PASSWORD,
    bcryptCost: 10,
    sealKeyPem: env.SEAL_PRIVATE_KEY,
  });
  const app = createApp({ env });

  const tokenFor = async (role: Role) => {
    const user = await User.findByPk(demo.users[role]!);
    if (!user) throw new Error(`no demo user for ${role}`);
    return signSessionToken(user.id, user.tokenVersion);
  };
  return {
    app,
    env,
    demo,
    databasePath,
    tokenFor,
    authFor: async (role) => `Bearer ${await tokenFor(role)}`,
    emailFor: (role) => DEMO_USERS.find((u) => u.role === role)!.email,
    close: async () => {
      await closeDatabase();
      await postgres?.drop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** Signs in through the API, as a browser would. */
export async function login(app: Express, email: string, password = TEST_PASSWORD) {
  return request(app).post('/api/auth/login').send({ email, password });
}
