import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../shared/schemas/checks.schema.ts';
import type { Connector, Pin } from '../../../shared/schemas/pin-map.schema.ts';
import {
  findingsByFeed,
  fuseLabel,
  pinChoices,
  worstRank,
} from '../../../src/features/feeds/lib/feed-display.ts';

describe('fuse labels', () => {
  it('names the colour printed on a blade fuse (industry charts)', () => {
    expect(fuseLabel(15)).toBe('15 A (blue)');
    expect(fuseLabel(7.5)).toBe('7.5 A (brown)');
    expect(fuseLabel(30)).toBe('30 A (green)');
  });

  it('says so for a rating that is not a blade fuse', () => {
    expect(fuseLabel(12)).toBe('12 A (not a standard blade fuse rating)');
  });
});

describe('pin choices', () => {
  const connector = (id: number, label: string) => ({ id, label }) as Connector;
  const pin = (id: number, connectorId: number, cavity: string, position: number, fn: string) =>
    ({ id, connectorId, cavity, position, function: fn }) as Pin;

  it('names pins "E2-9 function", connector by connector in face order', () => {
    const choices = pinChoices(
      [
        pin(3, 2, '10', 9, 'Fan relay'),
        pin(1, 1, '2', 1, ''),
        pin(2, 2, '9', 8, ' Fuel pump relay coil control '),
      ],
      [connector(1, 'E1'), connector(2, 'E2')],
    );
    expect(choices.map((c) => c.label)).toEqual([
      'E1-2',
      'E2-9 Fuel pump relay coil control',
      'E2-10 Fan relay',
    ]);
    expect(choices[1]).toMatchObject({ id: 2, name: 'E2-9', connectorLabel: 'E2' });
  });
});

describe('findings by feed', () => {
  const finding = (id: string, severity: Finding['severity'], feedId?: number) =>
    ({ id, severity, subject: feedId ? { feedId } : { pinIds: [1] } }) as Finding;

  it('groups a feed’s findings worst first and leaves pin findings out', () => {
    const map = findingsByFeed([
      finding('a', 'warning', 9),
      finding('b', 'error', 9),
      finding('c', 'error'),
      finding('d', 'note', 8),
    ]);
    expect(map.get(9)?.map((f) => f.id)).toEqual(['b', 'a']);
    expect([...map.keys()].sort()).toEqual([8, 9]);
    expect(worstRank(map.get(9))).toBe(0);
    expect(worstRank(undefined)).toBe(3);
  });
});
