import { describe, expect, it } from 'vitest';
import { runChecks } from '#shared/domain/checks/run-checks.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

const only = (s: ReturnType<typeof snapshot>, rule: string) =>
  runChecks(s, { sizeUnit: 'mm2' }).filter((f) => f.rule === rule);

describe('every pin decided', () => {
  it('lists the undecided pins in one error', () => {
    const [f] = only(
      snapshot({
        pins: [{ disposition: 'undecided' }, { disposition: 'keep' }, { disposition: 'undecided' }],
      }),
      'undecided_pins',
    );
    expect(f?.severity).toBe('error');
    expect(f?.subject.pinIds).toEqual([1, 3]);
    expect(f?.message).toMatch(/E1-1, E1-3/);
  });

  it('is silent when all pins are decided', () => {
    expect(
      only(
        snapshot({ pins: [{ disposition: 'keep' }, { disposition: 'empty' }] }),
        'undecided_pins',
      ),
    ).toHaveLength(0);
  });
});

describe('power pins joined to the vehicle', () => {
  it('flags a power-feed pin joined to a text destination with no fused feed', () => {
    const [f] = only(
      snapshot({
        pins: [{ signalClass: 'power_feed', disposition: 'join', destination: 'Battery terminal' }],
      }),
      'power_pin_unfused',
    );
    expect(f?.severity).toBe('error');
  });

  it('flags a power-feed pin joined to an unfused feed, and accepts a fused one', () => {
    expect(
      only(
        snapshot({
          pins: [
            { signalClass: 'power_feed', disposition: 'join', destinationFeedId: 1, sizeMm2: 1.5 },
          ],
          feeds: [{ fuseA: null }],
        }),
        'power_pin_unfused',
      ),
    ).toHaveLength(1);
    expect(
      only(
        snapshot({
          pins: [
            { signalClass: 'power_feed', disposition: 'join', destinationFeedId: 1, sizeMm2: 1.5 },
          ],
          feeds: [{ fuseA: 15 }],
        }),
        'power_pin_unfused',
      ),
    ).toHaveLength(0);
  });

  it('flags a joined wire smaller than its feed’s fuse protects and suggests a size', () => {
    // 0.5 mm² is thinner than 18 AWG: 20 A × 0.5/0.8231 = 12.15 A at 105 °C outside the engine bay
    // (Table 5 scaled by area, common practice) < 15 A. Smallest Table-rated size: 1 mm² (18 AWG row, 20 A) [C].
    const [f] = only(
      snapshot({
        pins: [
          { signalClass: 'power_feed', disposition: 'join', destinationFeedId: 1, sizeMm2: 0.5 },
        ],
        feeds: [{ fuseA: 15 }],
      }),
      'joined_wire_smaller_than_fuse_allows',
    );
    expect(f?.severity).toBe('error');
    expect(f?.values.ampacityA?.value).toBeCloseTo(12.1, 1);
    expect(f?.values.suggestedSize?.value).toBe('1 mm²');
    expect(
      only(
        snapshot({
          pins: [{ disposition: 'join', destinationFeedId: 1, sizeMm2: 1 }],
          feeds: [{ fuseA: 15 }],
        }),
        'joined_wire_smaller_than_fuse_allows',
      ),
    ).toHaveLength(0);
  });

  it('warns when a joined wire has no size to check', () => {
    expect(
      only(
        snapshot({
          pins: [{ disposition: 'join', destinationFeedId: 1, sizeMm2: null }],
          feeds: [{}],
        }),
        'joined_wire_size_missing',
      )[0]?.severity,
    ).toBe('warning');
  });
});

describe('sensor grounds', () => {
  it('warns when a sensor ground is joined to a chassis ground (common practice)', () => {
    const [f] = only(
      snapshot({
        pins: [
          {
            signalClass: 'sensor_ground',
            disposition: 'join',
            destination: 'Chassis ground stud, left inner wing',
          },
        ],
      }),
      'sensor_ground_extra_ground',
    );
    expect(f?.severity).toBe('warning');
    expect(f?.source).toMatch(/common practice/i);
  });

  it('warns when it is linked to a power-ground cavity', () => {
    const s = snapshot({
      pins: [
        { signalClass: 'sensor_ground', disposition: 'join', destinationPinId: 2 },
        {
          connectorId: 2,
          signalClass: 'power_ground',
          disposition: 'join',
          function: 'Ground stud G2',
        },
      ],
    });
    expect(only(s, 'sensor_ground_extra_ground')).toHaveLength(1);
  });

  it('accepts a sensor ground joined to the diagnostic signal ground', () => {
    const s = snapshot({
      pins: [
        { signalClass: 'sensor_ground', disposition: 'join', destinationPinId: 2 },
        {
          connectorId: 2,
          signalClass: 'sensor_ground',
          disposition: 'join',
          function: 'Signal ground',
        },
      ],
    });
    expect(only(s, 'sensor_ground_extra_ground')).toHaveLength(0);
    expect(
      only(
        snapshot({ pins: [{ signalClass: 'sensor_ground', disposition: 'keep' }] }),
        'sensor_ground_extra_ground',
      ),
    ).toHaveLength(0);
  });
});

describe('one destination used twice', () => {
  it('warns when two pins are linked to the same vehicle cavity', () => {
    const s = snapshot({
      pins: [
        { disposition: 'join', destinationPinId: 3 },
        { disposition: 'join', destinationPinId: 3 },
        { connectorId: 2, disposition: 'join' },
      ],
    });
    const [f] = only(s, 'destination_used_twice');
    expect(f?.severity).toBe('warning');
    expect(f?.message).toMatch(/E1-1 and E1-2 all go to V1-3/);
  });

  it('ignores a second link from a pin that is cut or de-pinned', () => {
    const s = snapshot({
      pins: [
        { disposition: 'join', destinationPinId: 3 },
        { disposition: 'cut', destinationPinId: 3 },
        { connectorId: 2 },
      ],
    });
    expect(only(s, 'destination_used_twice')).toHaveLength(0);
  });
});

describe('ECU outputs wired straight to a load', () => {
  const output = (loadCurrentA: number | null, driverRatedA: number | null) =>
    runChecks(
      snapshot({
        pins: [
          {
            function: 'Fan output',
            signalClass: 'actuator_output',
            disposition: 'extend',
            driverType: 'low_side',
            driverRatedA,
            loadCurrentA,
          },
        ],
      }),
      { sizeUnit: 'mm2' },
    ).filter((f) => f.rule === 'ecu_output_overload');

  it('flags an 8 A fan on a 0.5 A output and tells the fix (common practice, no source)', () => {
    const [f] = output(8, 0.5);
    expect(f?.severity).toBe('error');
    expect(f?.message).toMatch(/drive a relay coil instead/);
    expect(f?.message).toMatch(/low side/);
  });

  it('passes a load within the rating, and says nothing without a rating', () => {
    expect(output(0.2, 0.5)).toHaveLength(0);
    expect(output(8, null)).toHaveLength(0);
  });
});
