import request from 'supertest';
import { Connector, Pin } from '../../server/db/models/index.ts';
import type { BenchRow } from '../lib/report.ts';
import { compareWithBareRoute } from '../lib/http.ts';
import { benchContext } from '../lib/context.ts';

/** A conversion of `pinCount` pins on 100-cavity connectors, every pin filled in. */
export async function generatePinMap(conversionId: number, pinCount: number) {
  const perConnector = 100;
  for (let c = 0; c * perConnector < pinCount; c++) {
    const count = Math.min(perConnector, pinCount - c * perConnector);
    const connector = await Connector.create({
      conversionId,
      label: `G${c + 1}`,
      side: c === 0 ? 'vehicle' : 'ecu',
      cavityCount: count,
      rows: 4,
      columns: Math.ceil(count / 4),
    });
    await Pin.bulkCreate(
      Array.from({ length: count }, (_, i) => ({
        conversionId,
        connectorId: connector.id,
        cavity: String(i + 1),
        position: i,
        function: `Generated circuit ${c + 1}.${i + 1}`,
        signalClass: 'sensor_signal' as const,
        colour: 'BU/WH',
        sizeMm2: 0.5,
        insulationRatingC: 105,
        disposition: 'keep' as const,
        destination: `Bench test point ${i}`,
        runLengthM: 1.5,
        loadCurrentA: 0.1,
      })),
    );
  }
}

/** GET /api/conversions/:id/pins for a 1,000-pin conversion beside a bare route serving the same JSON. */
export async function pinsList(seconds: number): Promise<BenchRow[]> {
  const ctx = await benchContext();
  try {
    const conversionId = ctx.demo.conversions.draft;
    await Pin.destroy({ where: { conversionId } });
    await Connector.destroy({ where: { conversionId } });
    await generatePinMap(conversionId, 1000);
    const path = `/api/conversions/${conversionId}/pins`;
    const body = (await request(ctx.app).get(path).set(ctx.auth)).body;
    if (body.pins.length !== 1000) throw new Error(`expected 1000 pins, got ${body.pins.length}`);
    return await compareWithBareRoute(
      'GET …/pins (1,000 pins), 20 clients',
      ctx.app,
      path,
      ctx.auth,
      body,
      seconds,
    );
  } finally {
    await ctx.close();
  }
}
