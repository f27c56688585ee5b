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
    // [C] 0.75 mm² is thinner than 18 AWG: 20 A × 0.75 / 0.8231 = 18.22 A (Table 5, scaled).
    //     Conductor: 30 + 75 × (14 / 18.22)² = 74.27 °C (FAA AC 43.13-1B ¶11-66), × 1.21329.
    //     R = 0.017241 × 4 / 0.75 × 1.21329 = 0.11157 Ω; 14 A × R = 1.562 V in the copper
    //     (chassis return: the supply wire once).
    //     Budget (drop-budget.ts defaults): 20 A fuse at 14 A, 0.1 × 14/20 = 0.07 V (from memory)
    //     + 4 terminals × 0.005 V + chassis return 0.05 V (common practice) = 0.14 V
    //     → 1.702 V = 14.2 % of 12 V.
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
    expect(f?.values.conductorTempC?.value).toBeCloseTo(74.3, 1);
    expect(f?.values.copperDropV?.value).toBeCloseTo(1.562, 2);
    expect(f?.values.voltageDropV?.value).toBeCloseTo(1.702, 2);
    expect(f?.values.voltageDropPct?.value).toBeCloseTo(14.2, 1);
    // [C] Copper may take 0.36 − 0.14 = 0.22 V: R ≤ 0.01571 Ω. 4 mm² (12 AWG row, 45 A, 37.3 °C)
    //     gives 0.01841 Ω; 6 mm² (10 AWG row, 60 A, 34.1 °C) 0.01213 Ω → 6 mm².
    expect(f?.values.suggestedSize?.value).toBe('6 mm²');
    expect(f?.working.join('\n')).toMatch(/Fuse 20 A at 14 A: 0\.1 V × 14 \/ 20: 0\.07 V/);
    expect(f?.working.join('\n')).toMatch(/Chassis return: 0\.05 V/);
    expect(f?.source).toMatch(/ABYC E-11/);
    expect(f?.source).toMatch(/¶11-66/);
  });

  it('passes the same run in 10 mm² and holds a general circuit to 10 % as a warning', () => {
    expect(
      rules(
        snapshot({
          feeds: [
            {
              fuseA: 20,
              dropClass: 'critical',
              wire: wire({ sizeMm2: 10, lengthM: 4, returnPath: 'chassis' }),
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
    // [C] 1 mm² rates as 18 AWG: 20 × 0.85 = 17 A in the engine bay; 22 A runs it at
    //     50 + 55 × (22/17)² = 142.1 °C, × 1.47986: R = 0.017241 × 3 × 1.47986 = 0.07654 Ω,
    //     1.684 V; + 30 A fuse at 22 A 0.0733 V + 4 × 0.005 V = 1.777 V = 14.8 % > 10 %.
    expect(general?.severity).toBe('warning');
    expect(general?.values.voltageDropPct?.value).toBeCloseTo(14.8, 1);
  });

  it('counts the wire and the relay of the feed upstream on a relay output', () => {
    const s = snapshot({
      feeds: [
        {
          id: 1,
          name: 'Main',
          fuseA: 30,
          relay: { contactRatingA: 40, coilCurrentA: 0.15, coilPinId: null },
          wire: wire({ sizeMm2: 4, lengthM: 2 }),
          loads: [],
        },
        {
          id: 2,
          name: 'Branch',
          source: 'relay_output',
          sourceFeedId: 1,
          fuseA: 15,
          dropClass: 'critical',
          wire: wire({ sizeMm2: 1, lengthM: 3 }),
          loads: [{ id: 1, pinId: null, name: 'Lamp', currentA: 10, continuous: true }],
        },
      ],
    });
    const [f] = only(s, 'voltage_drop').filter((x) => x.subject.feedId === 2);
    const working = f?.working.join('\n') ?? '';
    expect(working).toMatch(/Wire of "Main" upstream/);
    expect(working).toMatch(/Fuse 15 A at 10 A/);
    expect(working).toMatch(/Fuse 30 A at 10 A/);
    expect(working).toMatch(/Relay contacts 40 A at 10 A/);
    // 4 terminals on each of the two feeds (common practice).
    expect(working).toMatch(/8 × terminal or splice/);
  });

  it('takes the workshop’s own allowances', () => {
    const s = snapshot({
      feeds: [
        {
          fuseA: 20,
          dropClass: 'critical',
          wire: wire({ sizeMm2: 10, lengthM: 4, returnPath: 'chassis' }),
          loads: [{ id: 1, pinId: null, name: 'Pump', currentA: 14, continuous: true }],
        },
      ],
    });
    const generous = {
      fuseV: 0.3,
      relayContactsV: 0.1,
      perConnectionV: 0.01,
      chassisReturnV: 0.05,
    };
    expect(
      runChecks(s, { sizeUnit: 'mm2', dropAllowances: generous }).map((f) => f.rule),
    ).toContain('voltage_drop');
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
    // The 1 mm² wire keeps its own exact label, never a "≈" gauge nobody sells.
    expect(f?.values.wireSize?.value).toBe('1 mm²');
  });
});

describe('fuse placement', () => {
  // 33 CFR 183.455(b): within 7 in (178 mm) of the source, 40 in (1,016 mm) when sheathed [V].
  const placed = (unfusedLengthMm: number | null, fuseSheathed = false) =>
    only(snapshot({ feeds: [{ fuseA: 15, unfusedLengthMm, fuseSheathed }] }), 'fuse_placement');

  it('flags 300 mm of unfused wire and passes 150 mm', () => {
    const [f] = placed(300);
    expect(f?.severity).toBe('error');
    expect(f?.values.limitMm?.value).toBe(178);
    expect(f?.source).toMatch(/183\.455/);
    expect(f?.working.join(' ')).toMatch(/183\.455\(b\).*borrowed for vehicles by analogy/);
    expect(placed(150)).toHaveLength(0);
    expect(placed(178)).toHaveLength(0);
  });

  it('allows 1,016 mm when the run is sheathed', () => {
    expect(placed(300, true)).toHaveLength(0);
    expect(placed(1016, true)).toHaveLength(0);
    expect(placed(1100, true)[0]?.values.limitMm?.value).toBe(1016);
  });

  it('says nothing while the length is not recorded', () => {
    expect(placed(null)).toHaveLength(0);
  });
});

describe('fuse families', () => {
  it('recommends within the family fitted and points past its largest rating', () => {
    // [C] 1.25 × 36 = 45 A: above the largest standard blade (40 A); a 50 A maxi would do.
    const [f] = only(
      snapshot({
        feeds: [
          {
            fuseA: 40,
            wire: wire({ sizeMm2: 10 }),
            loads: [{ id: 1, pinId: null, name: 'Blower', currentA: 36, continuous: true }],
          },
        ],
      }),
      'load_within_fuse',
    );
    expect(f?.message).toMatch(/a 50 A maxi blade fuse/);
    // The same load on a maxi blade of 50 A passes.
    const maxi = snapshot({
      feeds: [
        {
          fuseA: 50,
          fuseType: 'maxi_blade',
          wire: wire({ sizeMm2: 10 }),
          loads: [{ id: 1, pinId: null, name: 'Blower', currentA: 36, continuous: true }],
        },
      ],
    });
    expect(rules(maxi)).not.toContain('load_within_fuse');
  });

  it('checks a bolt-down fuse against the wire it protects like any other', () => {
    // [C] 16 mm² → 6 AWG row (13.3 ≤ 16 < 21.2 mm²): 120 A at 105 °C < 150 A.
    const [f] = only(
      snapshot({
        feeds: [
          {
            fuseA: 150,
            fuseType: 'bolt_down',
            wire: wire({ sizeMm2: 16 }),
            loads: [{ id: 1, pinId: null, name: 'Winch', currentA: 100, continuous: false }],
          },
        ],
      }),
      'fuse_protects_wire',
    );
    expect(f?.values.ampacityA?.value).toBe(120);
  });
});

describe('relay inrush and coil drive', () => {
  const relayFeed = (kind: 'resistive' | 'motor' | 'lamp', currentA: number, contactRatingA = 30) =>
    snapshot({
      feeds: [
        {
          fuseA: 30,
          relay: { contactRatingA, coilCurrentA: 0.15, coilPinId: null },
          wire: wire({ sizeMm2: 6 }),
          loads: [{ id: 1, pinId: null, name: 'Fan', currentA, continuous: true, kind }],
        },
      ],
    });

  it('allows for a motor’s and a lamp’s inrush (common practice, no source)', () => {
    // [C] 18 A resistive on 30 A contacts passes; the same 18 A motor needs 18 × 2 = 36 A.
    expect(only(relayFeed('resistive', 18), 'relay_contact_load')).toHaveLength(0);
    const [motor] = only(relayFeed('motor', 18), 'relay_contact_load');
    expect(motor?.values.neededA?.value).toBe(36);
    expect(motor?.message).toMatch(/switch-on surge of its motor load/);
    // [C] a 12 A lamp load needs 12 × 3 = 36 A of contact rating.
    expect(only(relayFeed('lamp', 12), 'relay_contact_load')[0]?.values.neededA?.value).toBe(36);
  });

  const driven = (coil: { coilResistanceOhm?: number; coilCurrentA?: number }, ratedA: number) =>
    only(
      snapshot({
        pins: [
          {
            function: 'Fan relay drive',
            signalClass: 'actuator_output',
            driverType: 'low_side',
            driverRatedA: ratedA,
          },
        ],
        feeds: [
          {
            fuseA: 30,
            relay: {
              contactRatingA: 40,
              coilCurrentA: coil.coilCurrentA ?? 0,
              coilPinId: 1,
              coilResistanceOhm: coil.coilResistanceOhm ?? null,
            },
            wire: wire({ sizeMm2: 6 }),
          },
        ],
      }),
      'relay_coil_driver',
    );

  it('passes a 60 Ω coil on a 0.5 A low-side output and flags a coil the output cannot carry', () => {
    // [C] Ohm's law: 12 V / 60 Ω = 0.2 A ≤ 0.5 A.
    expect(driven({ coilResistanceOhm: 60 }, 0.5)).toHaveLength(0);
    // [C] 12 V / 20 Ω = 0.6 A > 0.5 A.
    const [f] = driven({ coilResistanceOhm: 20 }, 0.5);
    expect(f?.severity).toBe('error');
    expect(f?.values.coilA?.value).toBeCloseTo(0.6, 3);
    expect(f?.working[0]).toMatch(/12 V \/ 20 Ω = 0\.6 A/);
    // Without a resistance the recorded coil current is compared.
    expect(driven({ coilCurrentA: 0.8 }, 0.5)).toHaveLength(1);
  });
});
