import { describe, expect, it } from 'vitest';
import { runChecks } from '#shared/domain/checks/run-checks.ts';
import {
  CAN_STUB_MAX_M,
  J1962_BUS_CAVITIES,
  busLineOf,
} from '#shared/domain/checks/signal-wiring-rules.ts';
import type { SnapshotHarness } from '#shared/schemas/harness.schema.ts';
import { box, relayPosition, snapshot } from '../../factories/snapshot.factory.ts';

type HarnessWire = SnapshotHarness['wires'][number];
type End = HarnessWire['ends'][number];

const rulesOf = (s: ReturnType<typeof snapshot>, rule: string) =>
  runChecks(s, { sizeUnit: 'mm2' }).filter((f) => f.rule === rule);

const wire = (id: number, a: End, b: End, over: Partial<HarnessWire> = {}): HarnessWire => ({
  id,
  conversionId: 1,
  label: `W-${String(id).padStart(3, '0')}`,
  colour: '',
  sizeMm2: 0.5,
  insulationRatingC: 105,
  lengthM: 1,
  zone: 'cabin',
  branch: '',
  notes: '',
  twistGroup: '',
  shielded: false,
  ends: [a, b],
  ...over,
});
const pin = (refId: number): End => ({ kind: 'pin', refId });
const splice = (refId: number): End => ({ kind: 'splice', refId });

function harness(over: Partial<SnapshotHarness>): SnapshotHarness {
  return { wires: [], splices: [], groundPoints: [], boxes: [], ...over };
}

/** ECU pins 1 (CAN high) and 2 (CAN low); vehicle pins 3 (CAN high) and 4 (CAN low). */
function canBus() {
  const s = snapshot({
    pins: [
      { function: 'CAN high', signalClass: 'communication', disposition: 'join' },
      { function: 'CAN low', signalClass: 'communication', disposition: 'join' },
      { connectorId: 2, function: 'CAN high', signalClass: 'communication', disposition: 'join' },
      { connectorId: 2, function: 'CAN low', signalClass: 'communication', disposition: 'join' },
    ],
  });
  s.harness = harness({ wires: [wire(1, pin(1), pin(3)), wire(2, pin(2), pin(4))] });
  return s;
}

describe('a CAN pair is twisted, both wires marked (ISO 11898-2: twisted pair)', () => {
  it('names the wires of a CAN pair run loose, and says what to do', () => {
    const [f] = rulesOf(canBus(), 'can_pair_untwisted');
    expect(f?.severity).toBe('warning');
    expect(f?.message).toMatch(/W-001 \(CAN high\), W-002 \(CAN low\)/);
    expect(f?.message).toMatch(/same twist group/);
    expect(f?.sources.map((x) => x.id)).toContain('iso-11898-2');
  });

  it('is content when both wires share a twist group', () => {
    const s = canBus();
    s.harness!.wires = s.harness!.wires.map((w) => ({ ...w, twistGroup: 'T1' }));
    expect(rulesOf(s, 'can_pair_untwisted')).toHaveLength(0);
  });

  it('still finds a group holding two CAN-high wires and no CAN-low', () => {
    const s = canBus();
    s.harness!.wires[0] = { ...s.harness!.wires[0]!, twistGroup: 'T1' };
    s.harness!.wires[1] = { ...s.harness!.wires[1]!, twistGroup: 'T2' };
    expect(rulesOf(s, 'can_pair_untwisted')[0]?.working).toHaveLength(2);
  });
});

describe(`CAN stubs stay short (ISO 11898-2; ${CAN_STUB_MAX_M} m from memory)`, () => {
  /** ECU CAN high (1, terminated) to a splice, on to a terminated module (3) and a stub to 5. */
  function branched(stubM: number) {
    const s = snapshot({
      pins: [
        {
          function: 'CAN high',
          signalClass: 'communication',
          disposition: 'join',
          terminationOhm: 120,
        },
        { function: 'CAN low', signalClass: 'communication', disposition: 'join' },
        {
          connectorId: 2,
          function: 'CAN high',
          signalClass: 'communication',
          disposition: 'join',
          terminationOhm: 120,
        },
        { connectorId: 2, function: 'Spare', signalClass: 'none' },
        { connectorId: 2, function: 'Gauge CAN high', signalClass: 'communication' },
      ],
    });
    s.harness = harness({
      splices: [
        {
          id: 1,
          conversionId: 1,
          label: 'S-09',
          sealed: true,
          branch: '',
          distanceMm: null,
          notes: '',
        },
      ],
      wires: [
        wire(1, pin(1), splice(1), { lengthM: 2 }),
        wire(2, splice(1), pin(3), { lengthM: 3 }),
        wire(3, splice(1), pin(5), { lengthM: stubM }),
      ],
    });
    return s;
  }

  it('finds a 1.2 m branch off the bus, not the bus runs to terminated nodes', () => {
    const found = rulesOf(branched(1.2), 'can_stub_long');
    expect(found).toHaveLength(1);
    expect(found[0]?.title).toMatch(/W-003/);
    expect(found[0]?.values.stubM?.value).toBe(1.2);
    expect(found[0]?.message).toMatch(/move the splice closer/);
  });

  it('lets a 0.2 m stub be', () => {
    expect(rulesOf(branched(0.2), 'can_stub_long')).toHaveLength(0);
  });
});

describe('the diagnostic connector (SAE J1962)', () => {
  it('knows the standard bus cavities: 6 CAN high, 14 CAN low, 7 K-line', () => {
    // SAE J1962 [V]: 6 CAN high, 14 CAN low, 7 K-line, 15 L-line, 2 and 10 J1850 + and −.
    expect(J1962_BUS_CAVITIES['6']).toBe('can_high');
    expect(J1962_BUS_CAVITIES['14']).toBe('can_low');
    expect(J1962_BUS_CAVITIES['7']).toBe('k_line');
    expect(busLineOf({ function: 'CAN-H' })).toBe('can_high');
    expect(busLineOf({ function: 'Can lo' })).toBe('can_low');
    expect(busLineOf({ function: 'K-line' })).toBe('k_line');
    expect(busLineOf({ function: 'Canister vent valve' })).toBeNull();
  });

  function withDlc(dlc6To: 'high' | 'low') {
    const s = snapshot({
      pins: [
        { function: 'CAN high', signalClass: 'communication', disposition: 'join' },
        { function: 'CAN low', signalClass: 'communication', disposition: 'join' },
        {
          connectorId: 3,
          cavity: '6',
          function: 'CAN high',
          signalClass: 'communication',
          disposition: 'join',
        },
        {
          connectorId: 3,
          cavity: '14',
          function: 'CAN low',
          signalClass: 'communication',
          disposition: 'join',
        },
      ],
    });
    s.connectors.push({
      id: 3,
      conversionId: 1,
      label: 'DLC',
      side: 'vehicle',
      cavityCount: 16,
      rows: 2,
      columns: 8,
      notes: 'Diagnostic connector',
    });
    s.harness = harness({
      wires:
        dlc6To === 'high'
          ? [wire(1, pin(1), pin(3)), wire(2, pin(2), pin(4))]
          : [wire(1, pin(2), pin(3)), wire(2, pin(1), pin(4))],
    });
    return s;
  }

  it('is an error when the ECU CAN pins are crossed onto cavities 6 and 14', () => {
    const found = rulesOf(withDlc('low'), 'diagnostic_pin_wrong_line');
    expect(found.map((f) => f.title)).toEqual([
      'Diagnostic connector DLC-6 is not on CAN high',
      'Diagnostic connector DLC-14 is not on CAN low',
    ]);
    expect(found[0]?.severity).toBe('error');
    expect(found[0]?.message).toMatch(/wired to E1-2 \(CAN low\)/);
    expect(found[0]?.sources.map((x) => x.id)).toEqual(['sae-j1962']);
  });

  it('passes CAN high to 6 and CAN low to 14', () => {
    expect(rulesOf(withDlc('high'), 'diagnostic_pin_wrong_line')).toHaveLength(0);
  });

  it('is an error when a bus cavity is named as another line', () => {
    const s = withDlc('high');
    s.pins[2] = { ...s.pins[2]!, function: 'CAN low' };
    expect(rulesOf(s, 'diagnostic_pin_wrong_line')[0]?.message).toMatch(/it is named CAN low/);
  });
});

describe('crank and cam sensor wires twisted or shielded (common practice, no source)', () => {
  function crank(over: Partial<HarnessWire>[]) {
    const s = snapshot({
      pins: [
        { function: 'Crank position sensor +', signalClass: 'sensor_signal', disposition: 'join' },
        { function: 'Crank position sensor −', signalClass: 'sensor_ground', disposition: 'join' },
        { connectorId: 2, function: 'Crank sensor +', signalClass: 'sensor_signal' },
        { connectorId: 2, function: 'Crank sensor −', signalClass: 'sensor_ground' },
      ],
    });
    s.harness = harness({
      wires: [wire(1, pin(1), pin(3), over[0]), wire(2, pin(2), pin(4), over[1])],
    });
    return s;
  }

  it('finds a crank signal run as plain wire', () => {
    const found = rulesOf(crank([{}, {}]), 'crank_cam_unprotected');
    expect(found).toHaveLength(1);
    expect(found[0]?.message).toMatch(/twist it with the sensor's return wire/);
  });

  it('passes a twisted pair and a shielded cable', () => {
    expect(
      rulesOf(crank([{ twistGroup: 'T2' }, { twistGroup: 'T2' }]), 'crank_cam_unprotected'),
    ).toHaveLength(0);
    expect(rulesOf(crank([{ shielded: true }, {}]), 'crank_cam_unprotected')).toHaveLength(0);
  });

  it('does not count a twist group of one wire', () => {
    expect(rulesOf(crank([{ twistGroup: 'T2' }, {}]), 'crank_cam_unprotected')).toHaveLength(1);
  });
});

describe('ECU main power from the main relay (common practice, no source)', () => {
  function ecuPower(fromRelay: boolean) {
    const s = snapshot({
      pins: [
        { function: 'ECU main feed 1', signalClass: 'power_feed', disposition: 'join' },
        {
          function: 'Battery constant feed (memory)',
          signalClass: 'power_feed',
          disposition: 'join',
        },
      ],
    });
    s.harness = harness({
      boxes: [
        box([
          relayPosition(5),
          { id: 6, kind: 'fuse', label: 'F1', fuseType: 'mini_blade', ratingA: 15, feedId: null },
        ]),
      ],
      wires: [
        wire(1, { kind: 'fuse', refId: 6, terminal: 'out' }, pin(1)),
        wire(
          2,
          fromRelay
            ? { kind: 'relay', refId: 5, terminal: '87' }
            : { kind: 'source', source: 'battery' },
          { kind: 'fuse', refId: 6, terminal: 'in' },
        ),
        wire(3, { kind: 'source', source: 'battery' }, pin(2)),
      ],
    });
    return s;
  }

  it('finds a main power pin fed straight from the battery, but not the memory feed', () => {
    const found = rulesOf(ecuPower(false), 'ecu_power_not_from_main_relay');
    expect(found).toHaveLength(1);
    expect(found[0]?.title).toBe('E1-1 not fed from the main relay');
    expect(found[0]?.message).toMatch(/wire it to the main relay's 87/);
  });

  it("passes a main power pin fed through its fuse from the relay's 87", () => {
    expect(rulesOf(ecuPower(true), 'ecu_power_not_from_main_relay')).toHaveLength(0);
  });
});

describe('electronic throttle pedal tracks (common practice, no source)', () => {
  const pedal = (second: 'keep' | 'cut') =>
    snapshot({
      pins: [
        { function: 'Pedal position 1 signal', signalClass: 'sensor_signal', disposition: 'join' },
        { function: 'Pedal position 2 signal', signalClass: 'sensor_signal', disposition: second },
      ],
    });

  it('is an error when one pedal track is cut and the other kept', () => {
    const [f] = rulesOf(pedal('cut'), 'pedal_track_removed');
    expect(f?.severity).toBe('error');
    expect(f?.message).toMatch(/Keep every pedal track/);
  });

  it('passes both tracks kept', () => {
    expect(rulesOf(pedal('keep'), 'pedal_track_removed')).toHaveLength(0);
  });
});

describe('a sensor reference carried on to a sensor is not a vehicle load', () => {
  it('lets a 5 V reference run through the bulkhead to the pedal sensor', () => {
    const s = snapshot({
      pins: [
        {
          function: 'Pedal sensor reference 5 V',
          signalClass: 'sensor_reference',
          disposition: 'join',
        },
        { connectorId: 2, function: 'Pedal sensor reference 5 V', signalClass: 'sensor_reference' },
        { connectorId: 2, function: 'Fuel gauge', signalClass: 'sensor_signal' },
      ],
    });
    s.harness = harness({ wires: [wire(1, pin(1), pin(2))] });
    expect(rulesOf(s, 'reference_feeds_vehicle')).toHaveLength(0);
    s.harness.wires.push(wire(2, pin(1), pin(3)));
    expect(rulesOf(s, 'reference_feeds_vehicle')).toHaveLength(1);
  });
});
