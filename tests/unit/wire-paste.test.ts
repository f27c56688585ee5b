import { describe, expect, it } from 'vitest';
import type { Wire } from '#shared/schemas/harness.schema.ts';
import { endOptions } from '../../src/features/harness/lib/end-options.ts';
import {
  endFromText,
  inversePatch,
  pastePatches,
} from '../../src/features/harness/lib/wire-paste.ts';

const wire = (id: number, label: string): Wire => ({
  id,
  conversionId: 1,
  label,
  colour: '',
  sizeMm2: null,
  insulationRatingC: 105,
  lengthM: null,
  zone: 'engine_bay',
  branch: '',
  notes: '',
  ends: [
    { kind: 'source', source: 'battery' },
    { kind: 'unresolved', text: '' },
  ],
  version: 3,
});

const options = endOptions({
  pins: [
    {
      id: 7,
      connectorId: 2,
      conversionId: 1,
      cavity: '10',
      position: 9,
      function: 'Cooling fan relay coil control',
    } as never,
  ],
  connectors: [{ id: 2, label: 'E2' } as never],
  splices: [],
  groundPoints: [
    {
      id: 4,
      conversionId: 1,
      label: 'G-2',
      location: 'chassis',
      strapSizeMm2: 6,
      notes: '',
      version: 0,
    },
  ],
  boxes: [
    {
      id: 1,
      conversionId: 1,
      label: 'Box',
      notes: '',
      version: 0,
      positions: [
        {
          id: 15,
          kind: 'relay',
          label: 'R4',
          contactRatingA: 40,
          coilResistanceOhm: null,
          feedId: null,
        },
      ],
    },
  ],
});

describe('ends from text', () => {
  it('reads a short name, the text the grid shows, and a loose end', () => {
    expect(endFromText('r4 relay · 87', options)).toEqual({
      kind: 'relay',
      refId: 15,
      terminal: '87',
    });
    expect(endFromText('E2-10 Cooling fan relay coil control', options)).toEqual({
      kind: 'pin',
      refId: 7,
    });
    expect(endFromText('G-2 chassis', options)).toEqual({ kind: 'ground', refId: 4 });
    expect(endFromText('Not yet fastened: horn', options)).toEqual({
      kind: 'unresolved',
      text: 'horn',
    });
    expect(endFromText('Z-9', options)).toBeNull();
  });
});

describe('pasting a block', () => {
  it('makes one patch per wire from the cursor down and right, and names what it cannot read', () => {
    const rows = [wire(1, 'W-001'), wire(2, 'W-002'), wire(3, 'W-003')];
    // Columns from "colour": colour, size, length.
    const { patches, problems } = pastePatches(
      rows,
      { row: 1, col: 1 },
      'RD\t1.5\t2\nBK\tthick\n',
      options,
    );
    expect(patches).toEqual([
      { wire: rows[1], patch: { colour: 'RD', sizeMm2: 1.5, lengthM: 2 } },
      { wire: rows[2], patch: { colour: 'BK' } },
    ]);
    expect(problems).toEqual(['W-003: Type a number, or leave it empty.']);
  });

  it('pastes an end into end B and keeps end A', () => {
    const rows = [wire(1, 'W-001')];
    const { patches } = pastePatches(rows, { row: 0, col: 6 }, 'G-2 chassis', options);
    expect(patches[0]?.patch.ends).toEqual([
      { kind: 'source', source: 'battery' },
      { kind: 'ground', refId: 4 },
    ]);
  });
});

describe('undo', () => {
  it('puts back only what the patch changed', () => {
    const w = { ...wire(1, 'W-001'), colour: 'RD', lengthM: 1.2 };
    expect(inversePatch(w, { colour: 'BK' })).toEqual({ colour: 'RD' });
    expect(inversePatch(w, { lengthM: null, ends: w.ends })).toEqual({
      lengthM: 1.2,
      ends: w.ends,
    });
  });
});
