import { describe, expect, it } from 'vitest';
import {
  colourOptions,
  AS_TYPED_KEY,
  destinationOptions,
  editorOptions,
} from '../../../src/features/pin-map/lib/editor-options.ts';
import { filterRows, NO_FILTER, revealRow } from '../../../src/features/pin-map/lib/filter.ts';
import { moveFocus, moveForKey } from '../../../src/features/pin-map/lib/navigation.ts';
import { applyEdits, replacePins } from '../../../src/features/pin-map/lib/pin-cache.ts';
import { countDispositions } from '../../../src/features/pin-map/lib/progress.ts';
import { toPinRows } from '../../../src/features/pin-map/lib/rows.ts';
import { connector, pin } from './fixtures.ts';

const connectors = [connector(), connector({ id: 2, label: 'V1', side: 'vehicle' })];
const rows = toPinRows(
  [
    pin({
      id: 1,
      function: 'Injector 1 drive',
      colour: 'BU/WH',
      disposition: 'keep',
      signalClass: 'actuator_output',
    }),
    pin({ id: 2, function: 'Tach output', destinationPinId: 3, disposition: 'join' }),
    pin({ id: 3, connectorId: 2, cavity: '3', function: 'Tachometer signal' }),
  ],
  connectors,
);

describe('grid rows', () => {
  it('name linked cavities and joined feeds in the destination', () => {
    const withFeed = toPinRows(
      [
        pin({ id: 1, destinationFeedId: 4 }),
        pin({ id: 2, destinationPinId: 3 }),
        pin({ id: 3, connectorId: 2, cavity: '3' }),
      ],
      connectors,
      [{ feedId: 4, name: 'Cooling fan' }],
    );
    expect(withFeed.map((r) => r.linkedDestination)).toEqual(['Feed: Cooling fan', 'V1-3', '']);
  });

  it('reuse the row of a pin that did not change', () => {
    const pins = rows.map((r) => r.pin);
    expect(toPinRows(pins, connectors)[0]).toBe(toPinRows(pins, connectors)[0]);
  });
});

describe('filtering the grid', () => {
  it('filters by connector, disposition, signal class and free text', () => {
    const ids = (f: Partial<typeof NO_FILTER>) =>
      filterRows(rows, { ...NO_FILTER, ...f }).map((r) => r.pin.id);
    expect(ids({})).toEqual([1, 2, 3]);
    expect(ids({ connectorId: 2 })).toEqual([3]);
    expect(ids({ disposition: 'join' })).toEqual([2]);
    expect(ids({ signalClass: 'actuator_output' })).toEqual([1]);
    expect(ids({ text: 'bu/wh' })).toEqual([1]);
    expect(ids({ text: 'v1-3' })).toEqual([2, 3]);
    expect(ids({ text: 'e1-2' })).toEqual([2]);
  });

  it('takes off only the clauses that hide a row', () => {
    const filter = { ...NO_FILTER, connectorId: 1, text: 'injector' };
    expect(revealRow(rows[1]!, filter)).toEqual({ ...NO_FILTER, connectorId: 1 });
    expect(revealRow(rows[2]!, filter)).toEqual(NO_FILTER);
  });
});

describe('moving the focused cell', () => {
  const size = { rows: 3, columns: 4, pageRows: 2 };
  it('moves by arrows within the grid and wraps Tab across rows', () => {
    expect(moveFocus({ row: 0, column: 0 }, 'up', size)).toEqual({ row: 0, column: 0 });
    expect(moveFocus({ row: 0, column: 3 }, 'next', size)).toEqual({ row: 1, column: 0 });
    expect(moveFocus({ row: 1, column: 0 }, 'previous', size)).toEqual({ row: 0, column: 3 });
    expect(moveFocus({ row: 2, column: 3 }, 'next', size)).toBeNull();
    expect(moveFocus({ row: 0, column: 1 }, 'pageDown', size)).toEqual({ row: 2, column: 1 });
  });
  it('reads keys', () => {
    expect(moveForKey('Tab', { shift: true, ctrl: false })).toBe('previous');
    expect(moveForKey('End', { shift: false, ctrl: true })).toBe('gridEnd');
    expect(moveForKey('a', { shift: false, ctrl: false })).toBeNull();
  });
});

describe('the cell editor’s suggestions', () => {
  it('offers base colours, then stripes once a base is typed', () => {
    expect(colourOptions('').map((o) => o.commit)).toContain('BK');
    expect(
      colourOptions('bu')
        .map((o) => o.commit)
        .slice(0, 3),
    ).toEqual(['BU', 'BU/BK', 'BU/BN']);
    expect(colourOptions('bu/w').map((o) => o.commit)).toEqual(['BU/WH']);
    expect(colourOptions('gn/y').map((o) => o.commit)).toEqual(['GNYE', 'GN/YE']);
    expect(colourOptions('bl').map((o) => o.commit)).toEqual(['BK', 'BU']);
  });

  it('offers the new feeds first, by name', () => {
    const ctx = {
      sizeUnit: 'mm2' as const,
      destinations: [{ pinId: 3, name: 'V1-3', function: 'Tachometer signal' }],
      feeds: [{ feedId: 1, name: 'ECU main' }],
    };
    expect(destinationOptions('', ctx, 2).map((o) => o.commit)).toEqual(['Feed: ECU main', 'V1-3']);
    expect(destinationOptions('ecu', ctx, 2).map((o) => o.commit)).toEqual(['Feed: ECU main']);
  });

  it('offers vehicle-side cavities by name or function, never the pin itself', () => {
    const ctx = {
      sizeUnit: 'mm2' as const,
      destinations: [{ pinId: 3, name: 'V1-3', function: 'Tachometer signal' }],
    };
    expect(destinationOptions('tach', ctx, 2).map((o) => o.commit)).toEqual(['V1-3']);
    expect(destinationOptions('', ctx, 3)).toEqual([]);
  });

  it('offers the text as typed last, and only when no suggestion reads the same', () => {
    const ctx = {
      sizeUnit: 'mm2' as const,
      destinations: [{ pinId: 3, name: 'V1-3', function: 'Tachometer signal' }],
      feeds: [{ feedId: 1, name: 'ECU main' }],
    };
    const ecu = editorOptions('destination', 'ECU', ctx, 2);
    expect(ecu.map((o) => o.commit)).toEqual(['Feed: ECU main', 'ECU']);
    expect(ecu[1]).toMatchObject({ key: AS_TYPED_KEY, label: 'Use “ECU” as typed' });
    expect(editorOptions('destination', 'dash lamp', ctx, 2).map((o) => o.key)).toEqual([
      AS_TYPED_KEY,
    ]);
    expect(editorOptions('destination', 'v1-3', ctx, 2).map((o) => o.commit)).toEqual(['V1-3']);
    expect(editorOptions('destination', '', ctx, 2).map((o) => o.key)).not.toContain(AS_TYPED_KEY);
  });
});

describe('the pins cache and progress', () => {
  it('applies edits without touching unchanged pins and puts server rows in place', () => {
    const pins = rows.map((r) => r.pin);
    const edited = applyEdits(pins, [{ id: 2, set: { colour: 'GN' } }]);
    expect(edited[0]).toBe(pins[0]);
    expect(edited[1]).toMatchObject({ colour: 'GN', version: 0 });
    const fresh = { ...edited[1]!, version: 1 };
    expect(replacePins(edited, [fresh])[1]).toBe(fresh);
  });

  it('counts pins by disposition', () => {
    const counts = countDispositions(rows.map((r) => r.pin));
    expect(counts).toMatchObject({ keep: 1, join: 1, undecided: 1, cut: 0 });
  });
});
