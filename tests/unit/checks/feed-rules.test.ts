import { describe, expect, it } from 'vitest';
import { runChecks } from '#shared/domain/checks/run-checks.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

const mm2 = { sizeUnit: 'mm2' as const };
const rules = (s: ReturnType<typeof snapshot>) => runChecks(s, mm2).map((f) => f.rule);
const only = (s: ReturnType<typeof snapshot>, rule: string) =>
  runChecks(s, mm2).filter((f) => f.rule === rule);

const wire = (over: Record<string, unknown> = {}) => ({
  sizeMm2: 1.5,
  insulationRatingC: 105,
  lengthM: 1,
  zone: 'cabin' as const,
  bundled: 1,
  returnPath: 'wire' as const,
  colour: '',
  ...over,
});

describe('fuse protects wire', () => {
  it('flags 1.0 mm² under a 30 A fuse in the engine bay and suggests a size', () => {
    // 1.0 mm² is rated by the 18 AWG row: 20 A at 105 °C (33 CFR 183.425 Table 5), × 0.85 in an
    // engine space (note 1) = 17 A < 30 A. 4 mm² → 12 AWG row: 45 × 0.85 = 38.25 A ≥ 30 [C].
    const [f] = only(
      snapshot({
        feeds: [
          {
            fuseA: 30,
            wire: wire({ sizeMm2: 1, zone: 'engine_bay' }),
            loads: [{ id: 1, pinId: null, name: 'Fan', currentA: 20, continuous: true }],
          },
        ],
      }),
      'fuse_protects_wire',
    );
    expect(f?.severity).toBe('error');
    expect(f?.values.ampacityA?.value).toBeCloseTo(17, 1);
    expect(f?.values.suggestedSize?.value).toBe('4 mm²');
    expect(f?.source).toMatch(/33 CFR 183\.425/);
    expect(f?.message).toMatch(/30 A fuse.*1 mm².*17 A/);
  });

  it('passes 1.5 mm² under a 20 A fuse outside the engine bay', () => {
    // 1.5 mm² → 16 AWG row: 25 A at 105 °C ≥ 20 A (Table 5).
    expect(
      rules(
        snapshot({
          feeds: [
            {
              fuseA: 20,
              wire: wire({ sizeMm2: 1.5 }),
              loads: [{ id: 1, pinId: null, name: 'Pump', currentA: 14, continuous: true }],
            },
          ],
        }),
      ),
    ).not.toContain('fuse_protects_wire');
  });

  it('checks a relay-output feed against the fuse upstream', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 30,
          wire: wire({ sizeMm2: 4 }),
          loads: [{ id: 1, pinId: null, name: 'a', currentA: 5, continuous: true }],
        },
        {
          source: 'relay_output',
          sourceFeedId: 1,
          fuseA: null,
          wire: wire({ sizeMm2: 0.75 }),
          loads: [{ id: 2, pinId: null, name: 'b', currentA: 5, continuous: true }],
        },
      ],
    });
    const f = only(s, 'fuse_protects_wire');
    expect(f).toHaveLength(1);
    expect(f[0]!.subject.feedId).toBe(2);
    expect(f[0]!.message).toMatch(/fuse of "Feed 1"/);
  });
});

describe('bundled wires', () => {
  it('apply the USCG bundle factor from three conductors up, as a conservative choice at 12 V', () => {
    // 1.5 mm² → 16 AWG row, 105 °C: 25 A (Table 5); four bundled × 0.60 (33 CFR 183.435) = 15 A < 20 A [C].
    const s = snapshot({
      feeds: [
        {
          fuseA: 20,
          wire: wire({ sizeMm2: 1.5, bundled: 4 }),
          loads: [{ id: 1, pinId: null, name: 'x', currentA: 10, continuous: true }],
        },
      ],
    });
    const [f] = only(s, 'fuse_protects_wire');
    expect(f?.values.ampacityA?.value).toBeCloseTo(15, 1);
    expect(f?.values.deratingFactor?.value).toBe(0.6);
    expect(f?.working.join(' ')).toMatch(/conservative choice/);
    // Two conductors: no factor, 25 A ≥ 20 A.
    s.feeds[0]!.wire.bundled = 2;
    expect(only(s, 'fuse_protects_wire')).toHaveLength(0);
  });
});

describe('unfused feeds', () => {
  it('flags a battery feed with no fuse as an error and a fire risk', () => {
    const [f] = only(snapshot({ feeds: [{ fuseA: null }] }), 'unfused_feed');
    expect(f?.severity).toBe('error');
    expect(f?.message).toMatch(/fire risk/);
  });

  it('accepts a relay-output feed fused upstream', () => {
    const s = snapshot({
      feeds: [
        { fuseA: 20, wire: wire({ sizeMm2: 2.5 }) },
        { source: 'relay_output', sourceFeedId: 1, fuseA: null },
      ],
    });
    expect(rules(s)).not.toContain('unfused_feed');
  });
});

describe('the fuse suits the load (125 %)', () => {
  it('flags a load the fuse cannot carry and names the standard size', () => {
    // 14 A continuous × 1.25 = 17.5 A → 20 A (NEC 210.20(A); blade ratings per ISO 8820-3 charts) [C].
    const [f] = only(
      snapshot({
        feeds: [
          {
            fuseA: 15,
            wire: wire({ sizeMm2: 2.5 }),
            loads: [{ id: 1, pinId: null, name: 'Pump', currentA: 14, continuous: true }],
          },
        ],
      }),
      'load_within_fuse',
    );
    expect(f?.severity).toBe('error');
    expect(f?.values.neededA?.value).toBe(17.5);
    expect(f?.values.recommendedFuseA?.value).toBe(20);
  });

  it('counts the loads of feeds powered through this feed’s relay', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 15,
          relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: null },
          wire: wire({ sizeMm2: 2.5 }),
          loads: [{ id: 1, pinId: null, name: 'ECU', currentA: 6, continuous: true }],
        },
        {
          source: 'relay_output',
          sourceFeedId: 1,
          fuseA: 10,
          loads: [{ id: 2, pinId: null, name: 'Injectors', currentA: 6, continuous: true }],
        },
      ],
    });
    // (6 + 6) × 1.25 = 15 A: exactly the 15 A fuse, so no error [C].
    expect(only(s, 'load_within_fuse')).toHaveLength(0);
    s.feeds[1]!.loads[0]!.currentA = 7;
    expect(only(s, 'load_within_fuse')[0]?.values.neededA?.value).toBe(16.25);
  });

  it('notes a fuse much larger than the load needs, and warns about a feed without loads', () => {
    expect(
      only(
        snapshot({
          feeds: [
            {
              fuseA: 15,
              loads: [{ id: 1, pinId: null, name: 'x', currentA: 2, continuous: true }],
            },
          ],
        }),
        'fuse_larger_than_load_needs',
      )[0]?.severity,
    ).toBe('note');
    expect(only(snapshot({ feeds: [{ loads: [] }] }), 'feed_without_loads')[0]?.severity).toBe(
      'warning',
    );
  });
});

describe('relay contacts', () => {
  it('flags a total load above the contact rating', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 30,
          relay: { contactRatingA: 20, coilCurrentA: 0.2, coilPinId: null },
          wire: wire({ sizeMm2: 4 }),
          loads: [{ id: 1, pinId: null, name: 'Fan', currentA: 22, continuous: true }],
        },
      ],
    });
    expect(only(s, 'relay_contact_load')[0]?.values.totalA?.value).toBe(22);
    s.feeds[0]!.relay!.contactRatingA = 40;
    expect(only(s, 'relay_contact_load')).toHaveLength(0);
  });
});

describe('voltage drop', () => {
  it('flags a 4 m run of 0.75 mm² to a 14 A pump against the 3 % critical limit', () => {
    // R = 0.017241 × 4 / 0.75 × (1 + 0.00393 × (30 − 20)) = 0.09557 Ω; 14 A × R = 1.338 V = 11.15 % [C]
    // (IACS copper; chassis return counts the supply wire once; 30 °C ambient outside engine spaces).
    const [f] = only(
      snapshot({
        feeds: [
          {
            fuseA: 20,
            dropClass: 'critical',
            wire: wire({ sizeMm2: 0.75, lengthM: 4, returnPath: 'chassis' }),
            loads: [{ id: 1, pinId: null, name: 'Pump', currentA: 14, continuous: true }],
          },
        ],
      }),
      'voltage_drop',
    );
    expect(f?.severity).toBe('error');
    expect(f?.values.voltageDropV?.value).toBeCloseTo(1.338, 2);
    expect(f?.values.voltageDropPct?.value).toBeCloseTo(11.15, 1);
    // 3 mm²: 0.017241 × 4 / 3 × 1.0393 × 14 = 0.3345 V = 2.79 % ≤ 3 %; 2.5 mm² gives 3.34 % [C].
    expect(f?.values.suggestedSize?.value).toBe('3 mm²');
    expect(f?.source).toMatch(/ABYC E-11/);
  });

  it('passes the same run in 4 mm² and holds a general circuit to 10 % as a warning', () => {
    expect(
      rules(
        snapshot({
          feeds: [
            {
              fuseA: 20,
              dropClass: 'critical',
              wire: wire({ sizeMm2: 4, lengthM: 4, returnPath: 'chassis' }),
              loads: [{ id: 1, pinId: null, name: 'Pump', currentA: 14, continuous: true }],
            },
          ],
        }),
      ),
    ).not.toContain('voltage_drop');
    const [general] = only(
      snapshot({
        feeds: [
          {
            fuseA: 30,
            dropClass: 'general',
            wire: wire({ sizeMm2: 1, lengthM: 1.5, zone: 'engine_bay' }),
            loads: [{ id: 1, pinId: null, name: 'Fan', currentA: 22, continuous: true }],
          },
        ],
      }),
      'voltage_drop',
    );
    // 0.017241 × 3 / 1 × (1 + 0.00393 × 30) × 22 = 1.272 V = 10.6 % > 10 % [C].
    expect(general?.severity).toBe('warning');
    expect(general?.values.voltageDropPct?.value).toBeCloseTo(10.6, 1);
  });

  it('uses a feed’s own limit when given', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 20,
          dropClass: 'general',
          dropLimitPct: 2,
          wire: wire({ sizeMm2: 1.5, lengthM: 2 }),
          loads: [{ id: 1, pinId: null, name: 'x', currentA: 10, continuous: true }],
        },
      ],
    });
    expect(only(s, 'voltage_drop')[0]?.values.limitPct?.value).toBe(2);
  });

  it('suggests AWG sizes in an AWG workshop', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 30,
          wire: wire({ sizeMm2: 1, zone: 'engine_bay' }),
          loads: [{ id: 1, pinId: null, name: 'Fan', currentA: 20, continuous: true }],
        },
      ],
    });
    const [f] = runChecks(s, { sizeUnit: 'awg' }).filter((x) => x.rule === 'fuse_protects_wire');
    // 30 A in the engine bay at 105 °C: 12 AWG = 45 × 0.85 = 38.25 A; 13 AWG is not a Table 5 row
    // and rates as 14 AWG = 35 × 0.85 = 29.75 A < 30 A (Table 5, note 1) [C].
    expect(f?.values.suggestedSize?.value).toBe('12 AWG');
    expect(f?.values.wireSize?.value).toBe('≈17 AWG');
  });
});
