import { describe, expect, it } from 'vitest';
import { runChecks } from '#shared/domain/checks/run-checks.ts';
import type { SnapshotHarness } from '#shared/schemas/harness.schema.ts';
import { box, relayPosition, snapshot } from '../../factories/snapshot.factory.ts';

const rulesOf = (s: ReturnType<typeof snapshot>, rule: string) =>
  runChecks(s, { sizeUnit: 'mm2' }).filter((f) => f.rule === rule);

/** Pin 1 on the ECU connector (id 1), pin 2 on the vehicle connector (id 2), linked. */
function linked(out: object, inp: object) {
  return snapshot({
    pins: [
      { disposition: 'join', destinationPinId: 2, ...out },
      { connectorId: 2, cavity: '1', disposition: 'join', ...inp },
    ],
  });
}

const harness = (over: Partial<SnapshotHarness>): SnapshotHarness => ({
  wires: [],
  splices: [],
  groundPoints: [],
  boxes: [],
  ...over,
});

describe('engine-speed and road-speed signals (common practice, no source)', () => {
  it('asks for a pull-up where an open collector meets a 12 V square input, and not otherwise', () => {
    const out = {
      function: 'Engine speed output',
      signalClass: 'output_signal' as const,
      pulseSignal: 'open_collector' as const,
    };
    const [f] = rulesOf(
      linked(out, { function: 'Tach', pulseSignal: 'square_12v' }),
      'pulse_no_pull_up',
    );
    expect(f?.severity).toBe('warning');
    expect(f?.message).toMatch(/Fit a pull-up resistor/);
    expect(f?.values.sends?.value).toBe('Open collector');
    expect(
      rulesOf(linked(out, { pulseSignal: 'open_collector' }), 'pulse_no_pull_up'),
    ).toHaveLength(0);
  });

  it('gives the converter ratio for a pulses-per-revolution mismatch', () => {
    // [C] 4 cylinders' ECU sends 2 per rev; a gauge set for 3 per rev needs a ratio of 3 / 2 = 1.5.
    const [f] = rulesOf(
      linked(
        { signalClass: 'output_signal', pulseSignal: 'square_12v', pulsesPerRev: 2 },
        { pulseSignal: 'square_12v', pulsesPerRev: 3 },
      ),
      'pulse_ratio',
    );
    expect(f?.values.ratio?.value).toBe(1.5);
    expect(
      rulesOf(
        linked({ signalClass: 'output_signal', pulsesPerRev: 2 }, { pulsesPerRev: 2 }),
        'pulse_ratio',
      ),
    ).toHaveLength(0);
  });

  it('flags an AC sensor into a square-wave input', () => {
    const s = linked(
      { signalClass: 'sensor_signal', pulseSignal: 'square_5v' },
      { pulseSignal: 'ac_sine' },
    );
    // The vehicle-side sender is the source here: AC into the ECU's square input.
    expect(rulesOf(s, 'pulse_wave_mismatch')).toHaveLength(1);
  });
});

describe('CAN terminations (ISO 11898-2: two 120 Ω, 60 Ω across the pair)', () => {
  const can = (terminations: Array<number | null>) =>
    snapshot({
      pins: [
        {
          function: 'CAN high',
          signalClass: 'communication',
          destinationPinId: 2,
          terminationOhm: terminations[0] ?? null,
        },
        {
          connectorId: 2,
          cavity: '6',
          function: 'CAN high',
          signalClass: 'communication',
          terminationOhm: terminations[1] ?? null,
        },
      ],
    });

  it('warns on one termination with the 120 Ω measured, passes two, and says nothing when none are recorded', () => {
    const [f] = rulesOf(can([120, null]), 'can_termination');
    expect(f?.values.measuresOhm?.value).toBe(120);
    expect(f?.values.expectedOhm?.value).toBe(60);
    expect(f?.source).toMatch(/ISO 11898-2/);
    expect(rulesOf(can([120, 120]), 'can_termination')).toHaveLength(0);
    expect(rulesOf(can([null, null]), 'can_termination')).toHaveLength(0);
  });
});

describe('shields, references, regulated circuits, the fuel pump, coils and lamps', () => {
  it('warns on a shield that reaches a ground point away from the ECU (common practice)', () => {
    const s = snapshot({ pins: [{ function: 'Crank sensor shield', signalClass: 'shield' }] });
    s.harness = harness({
      groundPoints: [
        {
          id: 1,
          conversionId: 1,
          label: 'G-1',
          location: 'engine_block',
          strapSizeMm2: null,
          notes: '',
        },
      ],
      wires: [
        {
          id: 1,
          conversionId: 1,
          label: 'W-001',
          colour: 'BK',
          sizeMm2: 0.5,
          insulationRatingC: 105,
          lengthM: 1,
          zone: 'engine_bay',
          branch: '',
          notes: '',
          ends: [
            { kind: 'pin', refId: 1 },
            { kind: 'ground', refId: 1 },
          ],
        },
      ],
    });
    expect(rulesOf(s, 'shield_grounded_far_end')).toHaveLength(1);
    s.harness.groundPoints[0]!.location = 'ecu_local';
    expect(rulesOf(s, 'shield_grounded_far_end')).toHaveLength(0);
  });

  it('refuses a sensor reference wired to a vehicle circuit (error, common practice)', () => {
    const s = linked(
      { function: 'Sensor reference 5 V', signalClass: 'sensor_reference' },
      { function: 'Fuel gauge' },
    );
    expect(rulesOf(s, 'reference_feeds_vehicle')[0]?.severity).toBe('error');
    const ok = linked({ function: 'Sensor reference 5 V', signalClass: 'sensor_reference' }, {});
    ok.connectors[1]!.side = 'engine';
    expect(rulesOf(ok, 'reference_feeds_vehicle')).toHaveLength(0);
  });

  it('says a cut emissions circuit may be unlawful, and never as an error', () => {
    const s = snapshot({
      pins: [
        { function: 'Purge valve', disposition: 'cut' },
        { function: 'Purge valve 2', disposition: 'keep' },
      ],
    });
    const found = rulesOf(s, 'regulated_circuit_removed');
    expect(found).toHaveLength(1);
    expect(found[0]?.severity).toBe('warning');
    expect(found[0]?.message).toMatch(/may be unlawful where the vehicle is used/);
  });

  it('asks for the ECU pump output and a crash cut-off on a fuel pump feed', () => {
    const s = snapshot({
      pins: [{ function: 'Fuel pump relay control', signalClass: 'output_signal' }],
      feeds: [
        { name: 'Fuel pump', relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: 1 } },
      ],
    });
    expect(rulesOf(s, 'fuel_pump_control')).toHaveLength(0);
    expect(rulesOf(s, 'fuel_pump_cutoff')).toHaveLength(1);
    s.feeds[0]!.relay!.coilPinId = null;
    expect(rulesOf(s, 'fuel_pump_control')).toHaveLength(1);
  });

  it('finds a relay coil switched by a low-side output with nothing on its other terminal', () => {
    const s = snapshot({
      pins: [{ function: 'Fan relay', signalClass: 'output_signal', driverType: 'low_side' }],
    });
    const coilWire = (id: number, terminal: '85' | '86', far: object) => ({
      id,
      conversionId: 1,
      label: `W-00${id}`,
      colour: '',
      sizeMm2: 0.5,
      insulationRatingC: 105,
      lengthM: null,
      zone: 'cabin' as const,
      branch: '',
      notes: '',
      ends: [
        { kind: 'relay' as const, refId: 9, terminal },
        far,
      ] as SnapshotHarness['wires'][number]['ends'],
    });
    s.harness = harness({
      boxes: [
        box([
          {
            id: 9,
            kind: 'relay',
            label: 'R1',
            contactRatingA: 40,
            coilResistanceOhm: 80,
            feedId: null,
          },
        ]),
      ],
      wires: [coilWire(1, '85', { kind: 'pin', refId: 1 })],
    });
    expect(rulesOf(s, 'coil_without_supply')[0]?.severity).toBe('error');
    s.harness.wires.push(coilWire(2, '86', { kind: 'source', source: 'ignition' }));
    expect(rulesOf(s, 'coil_without_supply')).toHaveLength(0);
  });

  it('notes a lamp output driving an LED (common practice)', () => {
    const s = linked(
      { function: 'Check-engine lamp', signalClass: 'output_signal' },
      { destination: 'New dash lamp, 12 V LED' },
    );
    expect(rulesOf(s, 'lamp_output_led')[0]?.severity).toBe('note');
  });
});

describe('ECU power and grounds (common practice, no source)', () => {
  const wire = (id: number, a: object, b: object) => ({
    id,
    conversionId: 1,
    label: `W-${String(id).padStart(3, '0')}`,
    colour: '',
    sizeMm2: 1.5,
    insulationRatingC: 105,
    lengthM: 1,
    zone: 'engine_bay' as const,
    branch: '',
    notes: '',
    ends: [a, b] as SnapshotHarness['wires'][number]['ends'],
  });

  it('asks for the main relay to be driven by the ECU, not plain ignition', () => {
    const s = snapshot({
      pins: [
        { function: 'ECU main feed', signalClass: 'power_feed', disposition: 'join' },
        { function: 'Main relay control', signalClass: 'output_signal' },
      ],
    });
    s.harness = harness({
      boxes: [box([relayPosition(5)])],
      wires: [
        wire(1, { kind: 'relay', refId: 5, terminal: '87' }, { kind: 'pin', refId: 1 }),
        wire(
          2,
          { kind: 'source', source: 'ignition' },
          { kind: 'relay', refId: 5, terminal: '86' },
        ),
        wire(3, { kind: 'relay', refId: 5, terminal: '85' }, { kind: 'source', source: 'battery' }),
      ],
    });
    expect(rulesOf(s, 'main_relay_plain_ignition')).toHaveLength(1);
    s.harness.wires[2] = wire(
      3,
      { kind: 'relay', refId: 5, terminal: '85' },
      { kind: 'pin', refId: 2 },
    );
    expect(rulesOf(s, 'main_relay_plain_ignition')).toHaveLength(0);
  });

  it('finds a power ground that ends nowhere, a strap too small for the ECU, and a sensor ground on a power ground', () => {
    const s = snapshot({
      pins: [
        { function: 'ECU main feed', signalClass: 'power_feed', disposition: 'join' },
        { function: 'Power ground 1', signalClass: 'power_ground', disposition: 'join' },
        { function: 'Sensor ground', signalClass: 'sensor_ground', disposition: 'join' },
      ],
      feeds: [
        {
          loads: [{ id: 1, pinId: 1, name: 'ECU', currentA: 30, continuous: true }],
          fuseA: 40,
          wire: {
            sizeMm2: 6,
            insulationRatingC: 105,
            lengthM: 1,
            zone: 'cabin',
            bundled: 1,
            returnPath: 'wire',
            colour: '',
          },
        },
      ],
    });
    s.harness = harness({
      splices: [
        {
          id: 1,
          conversionId: 1,
          label: 'S-01',
          sealed: true,
          branch: '',
          distanceMm: null,
          notes: '',
        },
      ],
      wires: [wire(1, { kind: 'pin', refId: 2 }, { kind: 'splice', refId: 1 })],
    });
    expect(rulesOf(s, 'power_ground_unreached')[0]?.severity).toBe('error');
    // [C] a 1 mm² strap on the block rates as 18 AWG, 20 × 0.85 = 17 A < the ECU feed's 30 A.
    s.harness.groundPoints.push({
      id: 1,
      conversionId: 1,
      label: 'G-1',
      location: 'engine_block',
      strapSizeMm2: 1,
      notes: '',
    });
    s.harness.wires.push(wire(2, { kind: 'splice', refId: 1 }, { kind: 'ground', refId: 1 }));
    expect(rulesOf(s, 'power_ground_unreached')).toHaveLength(0);
    const [strap] = rulesOf(s, 'ground_strap_small');
    expect(strap?.values.strapA?.value).toBeCloseTo(17, 1);
    expect(strap?.values.returnA?.value).toBe(30);
    s.harness.wires.push(wire(3, { kind: 'pin', refId: 3 }, { kind: 'pin', refId: 2 }));
    expect(rulesOf(s, 'sensor_ground_to_power_ground')).toHaveLength(1);
  });
});
