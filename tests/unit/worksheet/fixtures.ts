/** Snapshots and metas for the worksheet tests, built in memory. */
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { ConversionSnapshot, SnapshotPin } from '#shared/schemas/snapshot.schema.ts';
import type { WorksheetMeta } from '#server/modules/worksheets/pdf/meta.ts';

export const HASH = 'c0ffee00' + '1234abcd'.repeat(7);

export function meta(overrides: Partial<WorksheetMeta> = {}): WorksheetMeta {
  return {
    workshopName: 'Harrow Lane Engine Works',
    paperSize: 'A4',
    sizeUnit: 'mm2',
    serviceAllowancePct: 15,
    printedAt: new Date('2025-06-01T14:32:00Z'),
    revision: null,
    findings: [],
    ...overrides,
  };
}

export function signedOffRevision(number = 4): NonNullable<WorksheetMeta['revision']> {
  return {
    number,
    status: 'signed_off',
    hash: HASH,
    signOff: { reviewerName: 'Dana Whitlow', signedAt: '2025-05-30T08:15:00Z', hash: HASH },
  };
}

const CYCLE: Disposition[] = ['keep', 'keep', 'join', 'extend', 'depin', 'cut', 'keep', 'empty'];
const COLOURS = ['BU/WH', 'RD', 'GN/YE', 'BK', 'OG/BN', 'VT', 'GNYE', ''];

/**
 * A conversion of `pinCount` pins on connectors of up to 100 cavities (4 rows), the dispositions
 * mixed, two feeds, and some joined pins with run lengths. Functions are unique: "Circuit 2.17".
 */
export function bigSnapshot(pinCount: number): ConversionSnapshot {
  const connectors: ConversionSnapshot['connectors'] = [];
  const pins: SnapshotPin[] = [];
  const perConnector = 100;
  for (let c = 0; c * perConnector < pinCount; c++) {
    const count = Math.min(perConnector, pinCount - c * perConnector);
    connectors.push({
      id: c + 1,
      conversionId: 1,
      label: `G${c + 1}`,
      side: 'ecu',
      cavityCount: count,
      rows: 4,
      columns: Math.ceil(count / 4),
      notes: '',
    });
    for (let i = 0; i < count; i++) {
      const disposition = CYCLE[i % CYCLE.length]!;
      const joinsFeed = disposition === 'join' && i % 16 === 2;
      pins.push({
        id: pins.length + 1,
        connectorId: c + 1,
        conversionId: 1,
        cavity: String(i + 1),
        position: i,
        function: disposition === 'empty' ? '' : `Circuit ${c + 1}.${i + 1}`,
        signalClass: 'sensor_signal',
        colour: disposition === 'empty' ? '' : COLOURS[i % COLOURS.length]!,
        sizeMm2: disposition === 'empty' ? null : i % 3 === 0 ? 0.75 : 0.5,
        insulationRatingC: 105,
        disposition,
        destination: disposition === 'join' && !joinsFeed ? `Bench point ${i}` : '',
        destinationPinId: null,
        destinationFeedId: joinsFeed ? 1 + (i % 2) : null,
        runLengthM:
          disposition === 'join' || disposition === 'extend'
            ? i % 5 === 0
              ? null
              : 0.5 + (i % 7) * 0.25
            : null,
        loadCurrentA: null,
        driverType: null,
        driverRatedA: null,
        pulseSignal: null,
        pulsesPerRev: null,
        terminationOhm: null,
        notes: i % 25 === 0 ? 'Check the routing against the loom drawing.' : '',
      });
    }
  }
  const wire = (lengthM: number, colour: string, returnPath: 'wire' | 'chassis') => ({
    sizeMm2: 1.5,
    insulationRatingC: 105,
    lengthM,
    zone: 'engine_bay' as const,
    bundled: 1,
    returnPath,
    colour,
  });
  return {
    format: 1,
    conversion: {
      id: 1,
      name: 'Generated conversion',
      donorEngine: 'KT-20 2.0 L turbo I4',
      receivingVehicle: 'Corran 100 flatbed',
      systemVoltage: 12,
      notes: '',
    },
    workshop: { id: 1, name: 'Harrow Lane Engine Works' },
    connectors,
    pins,
    feeds: [
      {
        id: 1,
        conversionId: 1,
        name: 'Main feed',
        source: 'battery',
        sourceFeedId: null,
        fuseA: 15,
        relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: 3 },
        wire: wire(1.2, 'RD', 'wire'),
        loads: [{ id: 1, pinId: null, name: 'Controller', currentA: 6, continuous: true }],
        dropClass: 'critical',
        dropLimitPct: null,
        notes: '',
      },
      {
        id: 2,
        conversionId: 1,
        name: 'Switched feed',
        source: 'ignition',
        sourceFeedId: null,
        fuseA: 10,
        relay: null,
        wire: wire(2.5, 'RD/BK', 'chassis'),
        loads: [{ id: 2, pinId: 3, name: 'Sensor supply', currentA: 2, continuous: true }],
        dropClass: 'general',
        dropLimitPct: null,
        notes: '',
      },
    ],
  };
}
