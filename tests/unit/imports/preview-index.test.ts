import { describe, expect, it } from 'vitest';
import { cellKey, indexPreview } from '../../../src/features/imports/lib/preview.ts';

describe('placing preview problems', () => {
  const result = {
    mapping: [
      { header: 'Cavity', target: 'cavity' as const },
      { header: 'Colour', target: 'colour' as const },
    ],
    errors: [
      { row: null, column: null, message: 'file' },
      { row: 1, column: '__proto__', message: 'header' },
      { row: 5, column: 'Colour', message: 'bad colour' },
      { row: 7, column: null, message: 'wrong width' },
    ],
    changes: [
      { kind: 'add' as const, connector: 'E9', cavity: '2', row: 3, fields: [] },
      { kind: 'remove' as const, connector: 'E9', cavity: '9', pinId: 4, blank: true },
    ],
  };

  it('puts each problem in its cell, its line, or above the table', () => {
    const index = indexPreview(result);
    expect(index.file.map((e) => e.message)).toEqual(['file', 'header']);
    expect(index.cell.get(cellKey(5, 'Colour'))).toEqual(['bad colour']);
    expect(index.line.get(7)).toEqual(['wrong width']);
    expect([...index.problemRows]).toEqual([5, 7]);
    expect(index.change.get(3)?.kind).toBe('add');
  });
});
