import { describe, expect, it } from 'vitest';
import type { ImportField } from '#shared/schemas/imports.schema.ts';
import {
  detectTarget,
  headerSignature,
  parseMappingField,
  resolveMapping,
} from '#server/modules/imports/mapping.ts';
import { parseRows, parseRowsYielding } from '#server/modules/imports/rows.ts';

describe('column mapping', () => {
  it('recognises the canonical headers in any case, and "color"', () => {
    expect(detectTarget('CAVITY')).toBe('cavity');
    expect(detectTarget(' Color ')).toBe('colour');
    expect(detectTarget('Signal class')).toBe('signal_class');
    expect(detectTarget('Size mm²')).toBe('size_mm2');
    expect(detectTarget('Remarks')).toBe('ignore');
    expect(detectTarget('constructor')).toBe('ignore');
  });

  it('refuses a __proto__ header and notes ignored columns', () => {
    const m = resolveMapping(['cavity', '__proto__', 'Remarks'], 1, null, null);
    expect(m.errors).toEqual([
      expect.objectContaining({
        row: 1,
        column: '__proto__',
        message: expect.stringContaining('not allowed'),
      }),
    ]);
    expect(m.mapping.map((c) => c.target)).toEqual(['cavity', 'ignore', 'ignore']);
    expect(m.notes.join(' ')).toContain('"Remarks"');
  });

  it('uses the given mapping first, then a saved one, then the header names', () => {
    const headers = ['Pin', 'Wire', 'What'];
    const given = parseMappingField(JSON.stringify({ Pin: 'cavity', Wire: 'colour' }));
    const a = resolveMapping(headers, 1, given, ['ignore', 'ignore', 'function']);
    expect(a.source).toBe('given');
    expect(a.mapping.map((c) => c.target)).toEqual(['cavity', 'colour', 'ignore']);
    const b = resolveMapping(headers, 1, null, ['cavity', 'ignore', 'function']);
    expect(b.source).toBe('saved');
    expect(b.mapping.map((c) => c.target)).toEqual(['cavity', 'ignore', 'function']);
    const c = resolveMapping(headers, 1, null, null);
    expect(c.source).toBe('detected');
    expect(c.errors.map((e) => e.message).join()).toContain('No column is set to Cavity');
    expect(headerSignature(['Cavity', 'Colour'])).toBe(headerSignature([' cavity', 'COLOUR']));
  });

  it('reports two columns set to one field, and columns the file lacks', () => {
    const given = parseMappingField(JSON.stringify({ a: 'cavity', b: 'cavity', zz: 'notes' }));
    const m = resolveMapping(['a', 'b'], 1, given, null);
    expect(m.errors.map((e) => e.column)).toEqual(['zz', 'b']);
  });

  it('refuses a malformed mapping field with a 400', () => {
    expect(() => parseMappingField('{not json')).toThrow(/not valid JSON/);
    expect(() => parseMappingField(JSON.stringify({ a: 'owner' }))).toThrow(/must map to one of/);
    expect(() => parseMappingField(JSON.stringify(['cavity']))).toThrow(/JSON object/);
    // A __proto__ key stays an ordinary entry.
    const m = parseMappingField('{"__proto__":"notes"}');
    expect([...m!.entries()]).toEqual([['__proto__', 'notes']]);
    expect(({} as Record<string, unknown>).notes).toBeUndefined();
  });
});

function rowsOf(headers: string[], lines: string[][]) {
  const columnOf = new Map<ImportField, number>();
  headers.forEach((h, i) => {
    const t = detectTarget(h);
    if (t !== 'ignore') columnOf.set(t, i);
  });
  return parseRows(
    lines.map((cells, i) => ({ row: i + 2, cells })),
    headers,
    columnOf,
  );
}

describe('checking each cell', () => {
  it('reports a bad cell on every line it is on, and reads a repeated good cell alike', () => {
    const { rows, errors } = rowsOf(
      ['cavity', 'colour', 'disposition'],
      [
        ['1', 'PU', 'keep'],
        ['2', 'BU/WH', 'keep'],
        ['3', 'PU', 'keep'],
        ['4', 'BU/WH', 'keep'],
        ['5', 'BU/WH\u200B', 'keep'],
        ['6', 'BU/WH\u200B', 'keep'],
      ],
    );
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [2, 'colour'],
      [4, 'colour'],
      [6, 'colour'],
      [7, 'colour'],
    ]);
    expect(rows.map((r) => [r.cavity, r.values.colour, r.values.disposition])).toEqual([
      ['2', 'BU/WH', 'keep'],
      ['4', 'BU/WH', 'keep'],
    ]);
  });

  it('reads dispositions as codes or screen labels, and signal classes likewise', () => {
    const { rows, errors } = rowsOf(
      ['cavity', 'disposition', 'signal_class'],
      [
        ['1', 'De-pin', 'Power feed'],
        ['2', 'cut and insulate', 'sensor_ground'],
        ['3', 'Extend / reroute', ''],
        ['4', 'KEEP', 'Shield / drain'],
        ['5', '', ''],
      ],
    );
    expect(errors).toEqual([]);
    expect(rows.map((r) => r.values.disposition)).toEqual([
      'depin',
      'cut',
      'extend',
      'keep',
      'undecided',
    ]);
    expect(rows.map((r) => r.values.signalClass)).toEqual([
      'power_feed',
      'sensor_ground',
      'none',
      'shield',
      'none',
    ]);
  });

  it('reports unknown colours and dispositions with the allowed values, by line and column', () => {
    const { errors } = rowsOf(
      ['Cavity', 'Colour', 'Disposition'],
      [
        ['1', 'PU', 'keep'],
        ['2', 'BU', 'remove'],
      ],
    );
    expect(errors).toHaveLength(2);
    expect(errors[0]).toMatchObject({ row: 2, column: 'Colour' });
    expect(errors[0]!.message).toContain('BK, BN, RD');
    expect(errors[1]).toMatchObject({ row: 3, column: 'Disposition' });
    expect(errors[1]!.message).toContain('depin (De-pin)');
  });

  it('reads sizes in mm² (comma decimals too) or AWG, and checks that both agree', () => {
    const { rows, errors } = rowsOf(
      ['cavity', 'size_mm2', 'awg'],
      [
        ['1', '0,75', ''],
        ['2', '', '18'],
        ['3', '0.8231', '18'],
        ['4', '0.5', '16'],
        ['5', '0.8', ''],
      ],
    );
    // 0.8231 mm² is within 1 % of 18 AWG: stored as the one accepted area of that size.
    expect(rows.map((r) => r.values.sizeMm2)).toEqual([0.75, 0.823, 0.823]);
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [5, 'awg'],
      [6, 'size_mm2'],
    ]);
  });

  it('removes the formula guard, and refuses control characters and U+FFFD', () => {
    const { rows, errors } = rowsOf(
      ['cavity', 'function', 'notes'],
      [
        ['1', `'=HYPERLINK("x")`, "'-5 V"],
        ['2', 'ok\u0007', ''],
        ['3', 'caf\uFFFD', ''],
      ],
    );
    expect(rows[0]!.values).toMatchObject({ function: '=HYPERLINK("x")', notes: '-5 V' });
    expect(errors.map((e) => [e.row, e.column])).toEqual([
      [3, 'function'],
      [4, 'function'],
    ]);
  });

  it('reports a duplicate cavity on its second line and a row of the wrong width', () => {
    const { rows, errors } = rowsOf(
      ['cavity', 'function'],
      [['1', 'a'], ['2', 'b'], ['1', 'again'], ['3']],
    );
    expect(rows.map((r) => r.cavity)).toEqual(['1', '2']);
    expect(errors).toEqual([
      expect.objectContaining({
        row: 4,
        column: 'cavity',
        message: expect.stringContaining('line 2'),
      }),
      expect.objectContaining({ row: 5, column: null }),
    ]);
  });
});

describe('checking a big file', () => {
  it('lets the event loop turn every thousand records, with the same answer as in one go', async () => {
    const headers = ['cavity', 'function', 'colour'];
    const columnOf = new Map<ImportField, number>([
      ['cavity', 0],
      ['function', 1],
      ['colour', 2],
    ]);
    const records = Array.from({ length: 20_000 }, (_, i) => ({
      row: i + 2,
      cells: [String(i + 1), `Function ${i}`, i % 997 === 0 ? 'no such colour' : 'BU/GN'],
    }));
    // Turns of the event loop while the file is checked: other requests could run in each.
    let turns = 0;
    let checking = true;
    const turn = () => {
      if (!checking) return;
      turns += 1;
      setImmediate(turn);
    };
    setImmediate(turn);
    const stepped = await parseRowsYielding(records, headers, columnOf);
    checking = false;
    expect(turns).toBeGreaterThanOrEqual(19);
    expect(stepped).toEqual(parseRows(records, headers, columnOf));
    expect(stepped.errors).toHaveLength(21);
  });
});
