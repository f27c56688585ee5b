import request from 'supertest';
import type { BenchRow } from '../lib/report.ts';
import { compareWithBareRoute } from '../lib/http.ts';
import { benchContext } from '../lib/context.ts';

/** GET /api/conversions (auth, database, DTOs) beside a bare route serving the same JSON. */
export async function conversionsList(seconds: number): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const body = (await request(ctx.app).get('/api/conversions').set(ctx.auth)).body;
    return await compareWithBareRoute(
      'GET /api/conversions, 20 clients',
      ctx.app,
      '/api/conversions',
      ctx.auth,
      body,
      seconds,
    );
  } finally {
    await ctx.close();
  }
}
