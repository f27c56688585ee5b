import request from 'supertest';
import type { BenchRow } from '../lib/report.ts';
import { bareJsonApp, load } from '../lib/http.ts';
import { benchContext } from '../lib/context.ts';

/** GET /api/conversions (auth, database, DTOs) beside a bare route serving the same JSON. */
export async function conversionsList(seconds: number): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const body = (await request(ctx.app).get('/api/conversions').set(ctx.auth)).body;
    const app = await load(ctx.app, '/api/conversions', ctx.auth, { seconds });
    const bare = await load(bareJsonApp(body), '/bare', {}, { seconds });
    const name = 'GET /api/conversions, 20 clients';
    return [
      {
        case: name,
        subject: 'Loomwright',
        figures: { 'req/s': app.requestsPerSec, 'p99 ms': app.p99Ms, errors: app.errors },
      },
      {
        case: name,
        subject: 'bare Express, same JSON',
        figures: { 'req/s': bare.requestsPerSec, 'p99 ms': bare.p99Ms, errors: bare.errors },
      },
      {
        case: name,
        subject: 'ratio bare/Loomwright',
        figures: { 'req/s': bare.requestsPerSec / app.requestsPerSec },
      },
    ];
  } finally {
    await ctx.close();
  }
}
