import { describe, expect, it } from 'vitest';
import type { ImportField } from '#shared/schemas/imports.schema.ts';
import { BLANK_PIN_VALUES } from '#shared/schemas/pin-map.schema.ts';
import { planImport, type PinData, type PlanContext } from '#server/modules/imports/plan.ts';
import type { PinRow } from '#server/modules/imports/rows.ts';

let nextId = 100;
function pin(
  connectorId: number,
  cavity: string,
  position: number,
  set: Partial<PinData> = {},
): PinData {
  return { ...BLANK_PIN_VALUES, id: nextId++, connectorId, cavity, position, version: 3, ...set };
}

function context(pins: PinData[], extra: Partial<PlanContext> = {}): PlanContext {
  return {
    connectors: [
      { id: 1, label: 'E2', side: 'ecu', cavityCount: 3, rows: 1, columns: 3 },
      { id: 2, label: 'V1', side: 'vehicle', cavityCount: 2, rows: 1, columns: 2 },
    ],
    pins,
    feeds: [{ id: 7, name: 'ECU main' }],
    referencedPinIds: new Set(),
    target: { kind: 'connector', connectorId: 1 },
    ...extra,
  };
}

const row = (
  r: number,
  cavity: string,
  values: PinRow['values'],
  connector: string | null = null,
): PinRow => ({
  row: r,
  cavity,
  connector,
  values,
});
const header = (field: ImportField) => field;
const fields = (...f: ImportField[]) => new Set<ImportField>(['cavity', ...f]);
const mentioned = (rows: PinRow[]) =>
  rows.map((r) => ({ connector: r.connector, cavity: r.cavity }));

describe('planning an import into a connector', () => {
  it('updates matched cavities field by field, adds new ones and removes blank ones not in the file', () => {
    const e1 = pin(1, '1', 0, { function: 'Old', colour: 'BU' });
    const e2 = pin(1, '2', 1);
    const e3 = pin(1, '3', 2, { colour: 'RD' });
    const v1 = pin(2, '3', 0);
    const rows = [
      row(2, '1', { function: 'Main relay', colour: 'BU' }),
      row(3, '3', { function: 'Tacho out', colour: 'RD', destination: 'v1-3' }),
      row(4, 'A9', { function: 'New', destination: 'Feed: ECU main' }),
    ];
    const plan = planImport(
      context([e1, e2, e3, v1]),
      rows,
      mentioned(rows),
      header,
      fields('function', 'colour', 'destination'),
    );
    expect(plan.errors).toEqual([]);
    expect(plan.summary).toEqual({ added: 1, changed: 2, unchanged: 0, removed: 1 });
    const change = plan.changes.find((c) => c.kind === 'change' && c.cavity === '1');
    expect(change).toMatchObject({
      fields: [{ field: 'function', before: 'Old', after: 'Main relay' }],
    });
    const link = plan.changes.find((c) => c.kind === 'change' && c.cavity === '3');
    expect(link).toMatchObject({
      fields: expect.arrayContaining([
        { field: 'destination', label: 'Destination', before: '', after: '→ V1-3' },
      ]),
    });
    const [p] = plan.connectors;
    expect(p!.removes).toEqual([e2.id]);
    // Cavity 3 moves up into the removed cavity's place; versions go up only where fields changed.
    expect(p!.updates.map((u) => [u.cavity, u.position, u.version])).toEqual([
      ['1', 0, 4],
      ['3', 1, 4],
    ]);
    expect(p!.updates[1]!.destinationPinId).toBe(v1.id);
    // Feed words in the destination join the feed when the file has no feed column.
    expect(p!.adds).toEqual([
      expect.objectContaining({ cavity: 'A9', position: 2, destinationFeedId: 7, destination: '' }),
    ]);
    expect(p!.cavityCount).toBe(3);
  });

  it('refuses to drop cavities that hold data or that others point at, naming them', () => {
    const kept = pin(1, '1', 0);
    const worked = pin(1, '2', 1, { disposition: 'keep' });
    const target = pin(1, '3', 2);
    const rows = [row(2, '1', { function: 'x' })];
    const plan = planImport(
      context([kept, worked, target], { referencedPinIds: new Set([target.id]) }),
      rows,
      mentioned(rows),
      header,
      fields('function'),
    );
    expect(plan.errors).toHaveLength(1);
    expect(plan.errors[0]!.message).toMatch(/E2: cavities 2, 3 are not in the file/);
  });

  it('does not call a cavity missing when its row had a problem', () => {
    const a = pin(1, '1', 0, { function: 'keep me' });
    const plan = planImport(
      context([a]),
      [],
      [{ connector: null, cavity: '1' }],
      header,
      fields('function'),
    );
    expect(plan.errors).toEqual([]);
    expect(plan.connectors[0]!.removes).toEqual([]);
  });

  it('grows the connector face to hold new cavities, up to 400', () => {
    const rows = Array.from({ length: 40 }, (_, i) => row(i + 2, `A${i + 1}`, {}));
    const plan = planImport(
      context([pin(1, '1', 0)], {
        connectors: [{ id: 1, label: 'E9', side: 'ecu', cavityCount: 1, rows: 1, columns: 1 }],
      }),
      rows,
      mentioned(rows),
      header,
      fields(),
    );
    expect(plan.connectors[0]).toMatchObject({ cavityCount: 40, rows: 2, columns: 20 });
    const tooMany = Array.from({ length: 401 }, (_, i) => row(i + 2, `${i + 1}`, {}));
    const big = planImport(context([]), tooMany, mentioned(tooMany), header, fields());
    expect(big.errors[0]!.message).toContain('at most 400');
  });

  it('refuses rows for another connector, an unknown feed; an unchanged row changes nothing', () => {
    const a = pin(1, '1', 0, { function: 'same' });
    const rows = [
      row(2, '1', { function: 'same' }, 'E2'),
      row(3, '2', { feed: 'Fan' }, 'E2'),
      row(4, '9', {}, 'E1'),
    ];
    const plan = planImport(
      context([a]),
      rows,
      mentioned(rows),
      header,
      fields('connector', 'function', 'feed'),
    );
    expect(plan.errors.map((e) => [e.row, e.column])).toEqual([
      [4, 'connector'],
      [3, 'feed'],
    ]);
    expect(plan.summary.unchanged).toBe(1);
  });
});

describe('planning an import into a whole conversion', () => {
  it('routes rows by the connector column and leaves unnamed connectors alone', () => {
    const e = pin(1, '1', 0, { function: 'x' });
    const v = pin(2, '1', 0, { function: 'y' });
    const rows = [row(2, '1', { function: 'z' }, 'e2'), row(3, '5', {}, 'E7')];
    const plan = planImport(
      context([e, v], { target: { kind: 'conversion' } }),
      rows,
      mentioned(rows),
      header,
      fields('connector', 'function'),
    );
    expect(plan.errors).toEqual([
      expect.objectContaining({
        row: 3,
        column: 'connector',
        message: expect.stringContaining('no connector "E7"'),
      }),
    ]);
    expect(plan.connectors.map((c) => c.label)).toEqual(['E2']);
  });
});
