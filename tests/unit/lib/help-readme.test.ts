import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  firstTable,
  inline,
  numberedItems,
  section,
} from '../../../src/features/help/lib/readme.ts';

const readme = readFileSync(new URL('../../../README.md', import.meta.url), 'utf8');

describe('the Help page reads the README', () => {
  it('finds the tour, one item per screen', () => {
    const tour = numberedItems(section(readme, 'A tour'));
    expect(tour.length).toBeGreaterThanOrEqual(5);
    expect(tour[0]).toMatch(/^\*\*Pin map\*\*/);
    expect(tour.every((item) => !item.includes('\n'))).toBe(true);
  });

  it('finds every rule of the checks table with its severity and source', () => {
    const table = firstTable(section(readme, 'What the checks check, and on what authority'))!;
    expect(table.head).toEqual(['Rule', 'Severity', 'Source']);
    expect(table.rows.length).toBeGreaterThanOrEqual(10);
    expect(table.rows.every((r) => r.length === 3 && r[0])).toBe(true);
    expect(table.rows.map((r) => r[2])).toContain('common practice, no source');
  });

  it('reads bold, code and links inline', () => {
    expect(inline('a **b** `c` [d](e.md) f')).toEqual([
      { kind: 'text', text: 'a ' },
      { kind: 'strong', text: 'b' },
      { kind: 'text', text: ' ' },
      { kind: 'code', text: 'c' },
      { kind: 'text', text: ' ' },
      { kind: 'link', text: 'd', href: 'e.md' },
      { kind: 'text', text: ' f' },
    ]);
  });
});
