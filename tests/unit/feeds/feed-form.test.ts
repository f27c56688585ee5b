import { describe, expect, it } from 'vitest';
import { runCircuitCalc } from '../../../shared/domain/electrical/circuit-calc.ts';
import { awgAreaMm2, editableWireSize } from '../../../shared/domain/wire-sizes.ts';
import { CalcRequest } from '../../../shared/schemas/calc.schema.ts';
import type { Feed } from '../../../shared/schemas/feeds.schema.ts';
import {
  emptyFeedForm,
  feedFormSchema,
  feedToForm,
  formToRequest,
  isFormField,
  NO_FUSE,
  type FeedFormValues,
} from '../../../src/features/feeds/lib/feed-form.ts';
import {
  formToCalcRequest,
  loadTotals,
  upstreamFuse,
} from '../../../src/features/feeds/lib/feed-live-calc.ts';

/** The demo draft's cooling fan: 30 A fuse over 1 mm² in the engine bay (seeds/feeds-data.ts). */
const coolingFan: Feed = {
  id: 9,
  conversionId: 2,
  name: 'Cooling fan',
  source: 'battery',
  sourceFeedId: null,
  fuseA: 30,
  fuseType: 'standard_blade',
  unfusedLengthMm: null,
  fuseSheathed: false,
  relay: { contactRatingA: 40, coilCurrentA: 0.2, coilPinId: 162, coilResistanceOhm: null },
  wire: {
    sizeMm2: 1,
    insulationRatingC: 105,
    lengthM: 1.5,
    zone: 'engine_bay',
    bundled: 1,
    returnPath: 'wire',
    colour: 'BU',
    connections: 4,
  },
  loads: [
    {
      id: 4,
      pinId: null,
      name: 'Electric cooling fan',
      currentA: 22,
      continuous: true,
      kind: 'motor',
    },
  ],
  dropClass: 'general',
  dropLimitPct: null,
  notes: '',
  version: 3,
};

const requestOf = (feed: Feed) => ({
  name: feed.name,
  source: feed.source,
  sourceFeedId: feed.sourceFeedId,
  fuseA: feed.fuseA,
  fuseType: feed.fuseType,
  unfusedLengthMm: feed.unfusedLengthMm,
  fuseSheathed: feed.fuseSheathed,
  relay: feed.relay,
  wire: feed.wire,
  loads: feed.loads.map(({ id: _id, ...l }) => l),
  dropClass: feed.dropClass,
  dropLimitPct: feed.dropLimitPct,
  notes: feed.notes,
});

function valid(values: FeedFormValues, unit: 'mm2' | 'awg' = 'mm2') {
  const read = formToRequest(values, unit);
  if (!read.ok) throw new Error(`expected a valid form, got ${JSON.stringify(read.errors)}`);
  return read.request;
}

function errorsOf(values: FeedFormValues, unit: 'mm2' | 'awg' = 'mm2') {
  const read = formToRequest(values, unit);
  if (read.ok) throw new Error('expected errors');
  return read.errors;
}

describe('feed form ↔ request', () => {
  it('reads a stored feed back into the same request', () => {
    expect(valid(feedToForm(coolingFan, 'mm2'))).toEqual(requestOf(coolingFan));
  });

  it('keeps a metric size exactly in an AWG workshop, spelling out its unit', () => {
    const feed = { ...coolingFan, wire: { ...coolingFan.wire, sizeMm2: 4 } };
    const form = feedToForm(feed, 'awg');
    expect(form.wireSize).toBe('4 mm²');
    expect(valid(form, 'awg').wire.sizeMm2).toBe(4);
  });

  it('keeps an AWG size exactly in a metric workshop', () => {
    const area = Number(awgAreaMm2(16).toFixed(4));
    const feed = { ...coolingFan, wire: { ...coolingFan.wire, sizeMm2: area } };
    const form = feedToForm(feed, 'mm2');
    expect(form.wireSize).toBe('16 AWG');
    expect(valid(form, 'mm2').wire.sizeMm2).toBe(area);
  });

  it('shows a size in the workshop unit when it is one of that series', () => {
    expect(editableWireSize(1.5, 'mm2')).toBe('1.5');
    expect(editableWireSize(Number(awgAreaMm2(12).toFixed(4)), 'awg')).toBe('12');
  });

  it('reads sizes typed in either unit', () => {
    const form = feedToForm(coolingFan, 'mm2');
    expect(valid({ ...form, wireSize: '4' }).wire.sizeMm2).toBe(4);
    // A decimal comma, as many workshops write it.
    expect(valid({ ...form, wireSize: '1,5' }).wire.sizeMm2).toBe(1.5);
    // ASTM B258: 12 AWG is 2.05 mm across, 3.31 mm².
    expect(valid({ ...form, wireSize: '12' }, 'awg').wire.sizeMm2).toBeCloseTo(3.3088, 4);
    expect(valid({ ...form, wireSize: '2 AWG' }, 'mm2').wire.sizeMm2).toBeCloseTo(33.62, 1);
    expect(valid({ ...form, wireSize: '2.5 mm²' }, 'awg').wire.sizeMm2).toBe(2.5);
  });

  it('refuses a size outside the series, beside the size field', () => {
    const form = feedToForm(coolingFan, 'mm2');
    expect(errorsOf({ ...form, wireSize: '1.1' })['wire.sizeMm2']).toMatch(/ISO 6722/);
    expect(errorsOf({ ...form, wireSize: '31' }, 'awg')['wire.sizeMm2']).toMatch(/AWG/);
    expect(errorsOf({ ...form, wireSize: '' })['wire.sizeMm2']).toBe('is required');
  });

  it('names every missing field of an empty form by its request path', () => {
    const errors = errorsOf(emptyFeedForm({ insulationRatingC: 105 }));
    expect(Object.keys(errors).sort()).toEqual(
      ['fuseA', 'loads.0.currentA', 'loads.0.name', 'name', 'wire.lengthM', 'wire.sizeMm2'].sort(),
    );
  });

  it('needs the powering feed for a relay output, and drops it otherwise', () => {
    const form = feedToForm(coolingFan, 'mm2');
    expect(errorsOf({ ...form, source: 'relay_output', sourceFeedId: '' })).toHaveProperty(
      'sourceFeedId',
    );
    expect(valid({ ...form, source: 'relay_output', sourceFeedId: '6' }).sourceFeedId).toBe(6);
    expect(valid({ ...form, source: 'battery', sourceFeedId: '6' }).sourceFeedId).toBeNull();
  });

  it('maps "no fuse" and no relay to null, but wants a fuse chosen on purpose', () => {
    const form = feedToForm(coolingFan, 'mm2');
    const request = valid({ ...form, fuseA: NO_FUSE, hasRelay: false });
    expect(request.fuseA).toBeNull();
    expect(request.relay).toBeNull();
    expect(feedToForm({ ...coolingFan, fuseA: null }, 'mm2').fuseA).toBe(NO_FUSE);
    expect(errorsOf({ ...form, fuseA: '' }).fuseA).toBe('choose a rating, or “No fuse”');
  });

  it('normalises the colour and refuses a code IEC 60757 does not have', () => {
    const form = feedToForm(coolingFan, 'mm2');
    expect(valid({ ...form, colour: 'bu/wh' }).wire.colour).toBe('BU/WH');
    expect(errorsOf({ ...form, colour: 'XX' })['wire.colour']).toMatch(/IEC 60757/);
  });

  it('reports unreadable numbers and the schema limits beside their fields', () => {
    const form = feedToForm(coolingFan, 'mm2');
    const errors = errorsOf({
      ...form,
      lengthM: 'far',
      relayContactRatingA: '0',
      loads: [{ ...form.loads[0]!, currentA: '-1' }],
    });
    expect(errors['wire.lengthM']).toBe('must be a number');
    expect(errors).toHaveProperty('relay.contactRatingA');
    expect(errors).toHaveProperty('loads.0.currentA');
  });

  it('accepts a load that is a pin without a device name', () => {
    const form = feedToForm(coolingFan, 'mm2');
    const request = valid({
      ...form,
      loads: [{ key: 'a', pinId: '154', name: '', currentA: '5', continuous: true, kind: 'motor' }],
    });
    expect(request.loads).toEqual([
      { pinId: 154, name: '', currentA: 5, continuous: true, kind: 'motor' },
    ]);
  });

  it('carries the fuse family, its distance from the source and the coil resistance', () => {
    const form = feedToForm(coolingFan, 'mm2');
    const request = valid({
      ...form,
      fuseType: 'maxi_blade',
      fuseA: '40',
      unfusedLengthMm: '120',
      fuseSheathed: true,
      relayCoilResistanceOhm: '80',
      connections: '6',
    });
    expect(request).toMatchObject({
      fuseType: 'maxi_blade',
      fuseA: 40,
      unfusedLengthMm: 120,
      fuseSheathed: true,
      relay: { coilResistanceOhm: 80 },
      wire: { connections: 6 },
    });
    // Not measured yet: no length, and no finding about it.
    expect(valid({ ...form, unfusedLengthMm: '' }).unfusedLengthMm).toBeNull();
  });
});

describe('the form schema the zod resolver runs', () => {
  // The resolver hands the issues on by path; react-hook-form is left out here, as its types
  // bring the browser's DOM into the node test project.
  const issuesOf = (values: FeedFormValues, unit: 'mm2' | 'awg' = 'mm2') => {
    const result = feedFormSchema(unit).safeParse(values);
    if (result.success) throw new Error('expected issues');
    return Object.fromEntries(result.error.issues.map((i) => [i.path.join('.'), i.message]));
  };

  it('hands a valid form on as the request CreateFeedRequest accepted', () => {
    expect(feedFormSchema('mm2').parse(feedToForm(coolingFan, 'mm2'))).toEqual(
      requestOf(coolingFan),
    );
  });

  it('marks refusals at the request paths, where the server marks them too', () => {
    const form = feedToForm(coolingFan, 'mm2');
    const issues = issuesOf({
      ...form,
      wireSize: '1.1',
      lengthM: 'far',
      loads: [{ ...form.loads[0]!, currentA: '' }],
    });
    expect(issues['wire.sizeMm2']).toMatch(/ISO 6722/);
    expect(issues['wire.lengthM']).toBe('must be a number');
    expect(issues['loads.0.currentA']).toBe('is required');
    expect(issues).not.toHaveProperty('name');
  });
});

describe('server errors beside the fields', () => {
  it('knows which request paths the form marks', () => {
    for (const path of ['name', 'wire.sizeMm2', 'relay.coilPinId', 'loads', 'loads.3.currentA']) {
      expect(isFormField(path)).toBe(true);
    }
    for (const path of ['(body)', 'version', 'wire', 'loads.0.continuous']) {
      expect(isFormField(path)).toBe(false);
    }
  });
});

describe('the live calculation mirrors the checks', () => {
  const context = { systemV: 12, feedId: 9, feeds: [] };

  it('asks about the cooling fan as the checks see it, and gets the same 17 A', () => {
    const live = formToCalcRequest(feedToForm(coolingFan, 'mm2'), 'mm2', context);
    if (!live.ok) throw new Error(live.missing);
    expect(live.request).toEqual({
      currentA: 22,
      lengthM: 1.5,
      systemV: 12,
      sizeMm2: 1,
      returnPath: 'wire',
      // No temperature: the calculator takes the zone's Table 5 ambient and estimates the
      // conductor from the load (FAA AC 43.13-1B ¶11-66), as the checks do.
      insulationRatingC: 105,
      zone: 'engine_bay',
      bundled: 1,
      fuseA: 30,
      // ABYC E-11: 10 % for a general circuit.
      dropLimitPct: 10,
      fuseType: 'standard_blade',
    });
    const result = runCircuitCalc(CalcRequest.parse(live.request));
    // 18 AWG row, 105 °C: 20 A × 0.85 engine-space factor = 17 A (33 CFR 183.425 Table 5).
    expect(result.ampacityA).toBeCloseTo(17, 6);
    expect(result.fuseProtectsWire).toBe(false);
  });

  it('shows the fix: 4 mm² (rated as 12 AWG, 45 A × 0.85) is protected by 30 A', () => {
    const form = { ...feedToForm(coolingFan, 'mm2'), wireSize: '4' };
    const live = formToCalcRequest(form, 'mm2', context);
    if (!live.ok) throw new Error(live.missing);
    const result = runCircuitCalc(CalcRequest.parse(live.request));
    expect(result.ampacityA).toBeCloseTo(38.25, 6);
    expect(result.fuseProtectsWire).toBe(true);
  });

  it('asks by gauge for an AWG size and uses the override limit', () => {
    const form = { ...feedToForm(coolingFan, 'awg'), wireSize: '10', dropLimitPct: '5' };
    const live = formToCalcRequest(form, 'awg', context);
    if (!live.ok) throw new Error(live.missing);
    expect(live.request).toMatchObject({ awg: 10, dropLimitPct: 5 });
    expect(live.request).not.toHaveProperty('sizeMm2');
  });

  it('takes the fuse from up the chain and the loads of the feeds the relay powers', () => {
    const main = {
      id: 6,
      name: 'ECU main',
      source: 'battery' as const,
      sourceFeedId: null,
      fuseA: 15,
      loads: [],
    };
    const child = {
      id: 11,
      name: 'Injectors',
      source: 'relay_output' as const,
      sourceFeedId: 12,
      fuseA: null,
      loads: [{ currentA: 3, continuous: false }],
    };
    const form: FeedFormValues = {
      ...feedToForm(coolingFan, 'mm2'),
      source: 'relay_output',
      sourceFeedId: '6',
      fuseA: NO_FUSE,
    };
    const live = formToCalcRequest(form, 'mm2', { systemV: 12, feedId: 12, feeds: [main, child] });
    if (!live.ok) throw new Error(live.missing);
    expect(live.request.fuseA).toBe(15);
    expect(live.fuseFrom).toBe('ECU main');
    expect(live.request.currentA).toBe(25);
    expect(live.totals).toEqual({ continuousA: 22, nonContinuousA: 3, totalA: 25 });
  });

  it('says what is missing instead of asking', () => {
    const form = feedToForm(coolingFan, 'mm2');
    expect(formToCalcRequest({ ...form, loads: [] }, 'mm2', context)).toEqual({
      ok: false,
      missing: 'Add a load with its current.',
    });
    expect(formToCalcRequest({ ...form, wireSize: '1.1' }, 'mm2', context).ok).toBe(false);
    expect(formToCalcRequest({ ...form, lengthM: '0' }, 'mm2', context).ok).toBe(false);
  });

  it('counts unreadable load rows as nothing', () => {
    expect(
      loadTotals([
        { currentA: '5', continuous: true },
        { currentA: 'x', continuous: true },
        { currentA: '2,5', continuous: false },
      ]),
    ).toEqual({ continuousA: 5, nonContinuousA: 2.5, totalA: 7.5 });
  });

  it('finds no fuse when the chain reaches the battery without one', () => {
    const feeds = [
      { id: 1, name: 'A', source: 'battery' as const, sourceFeedId: null, fuseA: null, loads: [] },
    ];
    expect(upstreamFuse(1, feeds)).toBeNull();
  });
});
