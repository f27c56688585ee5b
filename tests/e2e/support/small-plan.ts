import { expect, type APIRequestContext } from '@playwright/test';

export interface SmallPlan {
  conversionId: number;
  feedId: number;
  pins: Array<{ id: number; cavity: string; version: number }>;
}

/**
 * A small conversion made through the API as the signed-in builder: one four-cavity ECU connector
 * (a supply, a sensor signal, a sensor ground, an empty cavity) and one fused battery feed.
 * `joined` decides whether the supply pin is already the feed's load.
 */
export async function createSmallPlan(
  request: APIRequestContext,
  name: string,
  { joined = true }: { joined?: boolean } = {},
): Promise<SmallPlan> {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  const ok = async (res: Awaited<ReturnType<APIRequestContext['get']>>): Promise<any> => {
    expect(res.ok(), await res.text()).toBe(true);
    return res.json();
  };
  const { conversion } = await ok(
    await request.post('/api/conversions', {
      data: {
        name,
        donorEngine: 'KT-16 1.6 L I4',
        receivingVehicle: 'Corran 100, 1976',
        systemVoltage: 12,
      },
    }),
  );
  const conversionId = conversion.id as number;
  await ok(
    await request.post(`/api/conversions/${conversionId}/connectors`, {
      data: { label: 'E5', side: 'ecu', cavityCount: 4 },
    }),
  );
  const listed = (await ok(await request.get(`/api/conversions/${conversionId}/pins`)))
    .pins as Array<{
    id: number;
    cavity: string;
    version: number;
  }>;
  const [first] = listed;
  const { feed } = await ok(
    await request.post(`/api/conversions/${conversionId}/feeds`, {
      data: {
        name: 'ECU supply',
        source: 'battery',
        sourceFeedId: null,
        fuseA: 10,
        relay: null,
        wire: {
          sizeMm2: 1.5,
          insulationRatingC: 105,
          lengthM: 1,
          zone: 'cabin',
          bundled: 1,
          returnPath: 'wire',
          colour: 'RD',
        },
        loads: joined ? [{ pinId: first!.id, name: 'ECU', currentA: 4, continuous: true }] : [],
        dropClass: 'critical',
        dropLimitPct: null,
        notes: '',
      },
    }),
  );
  // A feed load joins its pin (one fact), which moves the pin's version: read the pins again.
  const fresh = new Map(
    (
      (await ok(await request.get(`/api/conversions/${conversionId}/pins`))).pins as typeof listed
    ).map((p) => [p.id, p]),
  );
  const [supply, signal, ground, empty] = listed.map((p) => fresh.get(p.id)!);
  await ok(
    await request.post(`/api/conversions/${conversionId}/pins/batch`, {
      data: {
        changes: [
          {
            id: supply!.id,
            version: supply!.version,
            set: {
              function: 'ECU battery supply',
              signalClass: 'power_feed',
              disposition: 'join',
              colour: 'RD',
              sizeMm2: 1.5,
              loadCurrentA: 4,
              ...(joined ? { destinationFeedId: feed.id } : {}),
            },
          },
          {
            id: signal!.id,
            version: signal!.version,
            set: {
              function: 'Coolant temperature signal',
              signalClass: 'sensor_signal',
              disposition: 'keep',
              colour: 'GN',
            },
          },
          {
            id: ground!.id,
            version: ground!.version,
            set: {
              function: 'Sensor ground',
              signalClass: 'sensor_ground',
              disposition: 'keep',
              colour: 'BN',
            },
          },
          { id: empty!.id, version: empty!.version, set: { disposition: 'empty' } },
        ],
      },
    }),
  );
  const pins = (await ok(await request.get(`/api/conversions/${conversionId}/pins`))).pins;
  return { conversionId, feedId: feed.id as number, pins };
}
