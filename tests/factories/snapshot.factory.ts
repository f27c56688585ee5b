import type { Feed } from '#shared/schemas/feeds.schema.ts';
import { BLANK_PIN_VALUES } from '#shared/schemas/pin-map.schema.ts';
import type { ConversionSnapshot, SnapshotPin } from '#shared/schemas/snapshot.schema.ts';

/** A small conversion for rule tests: one ECU connector (id 1) and one vehicle connector (id 2). */
export function snapshot(
  parts: { pins?: Partial<SnapshotPin>[]; feeds?: Partial<Omit<Feed, 'version'>>[] } = {},
): ConversionSnapshot {
  const pins: SnapshotPin[] = (parts.pins ?? []).map((p, i) => ({
    id: i + 1,
    connectorId: 1,
    conversionId: 1,
    cavity: String(i + 1),
    position: i,
    ...BLANK_PIN_VALUES,
    function: `Pin ${i + 1}`,
    sizeMm2: 0.5,
    insulationRatingC: 105,
    disposition: 'keep',
    ...p,
  }));
  const feeds = (parts.feeds ?? []).map((f, i) => ({
    id: i + 1,
    conversionId: 1,
    name: `Feed ${i + 1}`,
    source: 'battery' as const,
    sourceFeedId: null,
    fuseA: 15,
    relay: null,
    wire: {
      sizeMm2: 1.5,
      insulationRatingC: 105,
      lengthM: 1,
      zone: 'cabin' as const,
      bundled: 1,
      returnPath: 'wire' as const,
      colour: '',
    },
    loads: [{ id: i + 1, pinId: null, name: 'Load', currentA: 8, continuous: true }],
    dropClass: 'general' as const,
    dropLimitPct: null,
    notes: '',
    ...f,
  }));
  return {
    format: 1,
    conversion: {
      id: 1,
      name: 'Test',
      donorEngine: 'KT-20',
      receivingVehicle: 'Corran 100',
      systemVoltage: 12,
      notes: '',
    },
    workshop: { id: 1, name: 'Harrow Lane Engine Works' },
    connectors: [
      {
        id: 1,
        conversionId: 1,
        label: 'E1',
        side: 'ecu',
        cavityCount: 40,
        rows: 2,
        columns: 20,
        notes: '',
      },
      {
        id: 2,
        conversionId: 1,
        label: 'V1',
        side: 'vehicle',
        cavityCount: 12,
        rows: 2,
        columns: 6,
        notes: '',
      },
    ],
    pins,
    feeds,
  };
}

/** A relay and fuse box (id 1) holding the given positions, for harness rule tests. */
export function box(
  positions: NonNullable<ConversionSnapshot['harness']>['boxes'][number]['positions'],
): NonNullable<ConversionSnapshot['harness']>['boxes'][number] {
  return { id: 1, conversionId: 1, label: 'Box', notes: '', positions };
}

/** A relay position with no coil figure, tied to no feed. */
export const relayPosition = (id: number, label = 'R1', contactRatingA = 30) =>
  ({
    id,
    kind: 'relay',
    label,
    contactRatingA,
    coilResistanceOhm: null,
    feedId: null,
  }) as const;
