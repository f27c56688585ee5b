/**
 * The demo's new fused feeds (sizes are demo values). Pins are named "E2-9" and resolved to ids when
 * seeding. The draft plants two feed problems: the cooling fan drawn in 1.0 mm² under a 30 A fuse
 * (the fuse does not protect the wire) and a 4 m run to the rear fuel pump in 0.75 mm² (voltage
 * drop too high). The signed-off plan's critical feeds are sized for the whole drop budget: fuse,
 * relay contacts, terminals and chassis return on top of the wire (2.5 mm² ECU main, 6 mm² pump).
 */
import type { CreateFeedRequest } from '#shared/schemas/feeds.schema.ts';

export interface DemoFeed extends Omit<CreateFeedRequest, 'sourceFeedId' | 'relay' | 'loads'> {
  sourceFeed: string | null;
  relay: { contactRatingA: number; coilCurrentA: number; coilPin: string | null } | null;
  loads: Array<{ pin: string | null; name: string; currentA: number; continuous: boolean }>;
  /** Pins whose destination is this feed. */
  joinedPins: string[];
}

const ECU_MAIN: DemoFeed = {
  name: 'ECU main',
  source: 'battery',
  sourceFeed: null,
  fuseA: 15,
  relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPin: 'E2-1' },
  wire: {
    sizeMm2: 2.5,
    insulationRatingC: 105,
    lengthM: 1,
    zone: 'engine_bay',
    bundled: 1,
    returnPath: 'wire',
    colour: 'RD',
  },
  loads: [
    { pin: 'E2-2', name: 'ECU main feed 1', currentA: 5, continuous: true },
    { pin: 'E2-3', name: 'ECU main feed 2', currentA: 5, continuous: true },
  ],
  dropClass: 'critical',
  dropLimitPct: null,
  notes: 'Main relay R1 in the new fuse and relay block; the ECU switches the coil to ground.',
  joinedPins: ['E2-2', 'E2-3'],
};

const IGNITION_COILS: DemoFeed = {
  name: 'Ignition coils',
  source: 'ignition',
  sourceFeed: null,
  fuseA: 15,
  relay: null,
  wire: {
    sizeMm2: 1.5,
    insulationRatingC: 105,
    lengthM: 1.2,
    zone: 'engine_bay',
    bundled: 1,
    returnPath: 'chassis',
    colour: 'RD/GN',
  },
  loads: [
    { pin: 'E1-37', name: 'Coil-on-plug supply, four coils', currentA: 10, continuous: true },
  ],
  dropClass: 'general',
  dropLimitPct: null,
  notes: '',
  joinedPins: ['E1-37'],
};

const FUEL_PUMP: DemoFeed = {
  name: 'Fuel pump',
  source: 'battery',
  sourceFeed: null,
  fuseA: 20,
  relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPin: 'E2-9' },
  wire: {
    sizeMm2: 6,
    insulationRatingC: 105,
    lengthM: 4,
    zone: 'cabin',
    bundled: 1,
    returnPath: 'chassis',
    colour: 'BK/YE',
  },
  loads: [{ pin: null, name: 'In-tank fuel pump, rear of bed', currentA: 14, continuous: true }],
  dropClass: 'critical',
  dropLimitPct: null,
  notes: 'Pump grounds to the chassis rail beside the tank.',
  joinedPins: [],
};

const COOLING_FAN: DemoFeed = {
  name: 'Cooling fan',
  source: 'battery',
  sourceFeed: null,
  fuseA: 30,
  relay: { contactRatingA: 40, coilCurrentA: 0.2, coilPin: 'E2-10' },
  wire: {
    sizeMm2: 4,
    insulationRatingC: 105,
    lengthM: 1.5,
    zone: 'engine_bay',
    bundled: 1,
    returnPath: 'wire',
    colour: 'BU',
  },
  loads: [
    { pin: null, name: 'Electric cooling fan (from the donor)', currentA: 22, continuous: true },
  ],
  dropClass: 'general',
  dropLimitPct: null,
  notes: '',
  joinedPins: [],
};

const DIAGNOSTIC: DemoFeed = {
  name: 'Diagnostic and memory',
  source: 'battery',
  sourceFeed: null,
  fuseA: 10,
  relay: null,
  wire: {
    sizeMm2: 1,
    insulationRatingC: 105,
    lengthM: 2.5,
    zone: 'cabin',
    bundled: 1,
    returnPath: 'wire',
    colour: 'RD/WH',
  },
  loads: [
    {
      pin: 'DLC-16',
      name: 'Diagnostic connector battery +, tools plugged in',
      currentA: 8,
      continuous: false,
    },
    { pin: 'E2-5', name: 'ECU memory', currentA: 0.2, continuous: true },
  ],
  dropClass: 'general',
  dropLimitPct: null,
  notes: '',
  joinedPins: ['DLC-16', 'E2-5'],
};

export const SIGNED_OFF_FEEDS: DemoFeed[] = [
  ECU_MAIN,
  IGNITION_COILS,
  FUEL_PUMP,
  COOLING_FAN,
  DIAGNOSTIC,
];

export const DRAFT_FEEDS: DemoFeed[] = [
  ECU_MAIN,
  IGNITION_COILS,
  { ...FUEL_PUMP, wire: { ...FUEL_PUMP.wire, sizeMm2: 0.75 } },
  { ...COOLING_FAN, wire: { ...COOLING_FAN.wire, sizeMm2: 1 } },
  DIAGNOSTIC,
];
