import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  canonicalRevisionContent,
  revisionHash,
  sha256Hex,
} from '#shared/domain/revisions/content-hash.ts';
import { countChanges, diffSnapshots } from '#shared/domain/revisions/diff.ts';
import { snapshot } from '../../factories/snapshot.factory.ts';

describe('content hash', () => {
  it('is the SHA-256 of the canonical JSON', async () => {
    // FIPS 180-4 test vector: SHA-256("abc").
    expect(await sha256Hex('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
    const s = snapshot({ pins: [{ function: 'Injector 1' }] });
    const text = canonicalRevisionContent(s, []);
    expect(await revisionHash(s, [])).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
  });

  it('does not depend on key order, and changes with the content', async () => {
    const s = snapshot({ pins: [{ function: 'Injector 1' }] });
    const reordered = JSON.parse(
      JSON.stringify({
        pins: s.pins,
        feeds: s.feeds,
        workshop: s.workshop,
        connectors: s.connectors,
        conversion: s.conversion,
        format: 1,
      }),
    );
    expect(await revisionHash(reordered, [])).toBe(await revisionHash(s, []));
    const changed = structuredClone(s);
    changed.pins[0]!.function = 'Injector 2';
    expect(await revisionHash(changed, [])).not.toBe(await revisionHash(s, []));
  });
});

describe('differences between revisions', () => {
  it('reports pins added, removed and changed field by field, matched by connector and cavity', () => {
    const before = snapshot({
      pins: [{ function: 'A' }, { function: 'B', disposition: 'keep' }, { function: 'C' }],
    });
    const after = snapshot({ pins: [{ function: 'A' }, { function: 'B', disposition: 'depin' }] });
    after.pins.push({ ...after.pins[1]!, id: 99, cavity: '9', position: 8, function: 'New' });
    const d = diffSnapshots(before, after);
    expect(d.pins.changed).toEqual([
      {
        name: 'E1-2',
        pinId: 2,
        function: 'B',
        connector: expect.stringMatching(/^E1, /),
        fields: [{ field: 'disposition', before: 'keep', after: 'depin' }],
      },
    ]);
    // Each pin is named with what it does and where it is, not by its cavity alone.
    expect(d.pins.removed).toEqual([
      { name: 'E1-3', pinId: 3, function: 'C', connector: expect.stringMatching(/^E1, /) },
    ]);
    expect(d.pins.added).toEqual([
      { name: 'E1-9', pinId: 99, function: 'New', connector: expect.stringMatching(/^E1, /) },
    ]);
    expect(countChanges(d)).toBe(3);
  });

  it('compares linked destinations by what they point at', () => {
    const before = snapshot({ pins: [{ destinationPinId: 2 }, { connectorId: 2 }] });
    const after = structuredClone(before);
    expect(countChanges(diffSnapshots(before, after))).toBe(0);
    after.pins[0]!.destinationPinId = null;
    expect(diffSnapshots(before, after).pins.changed[0]!.fields).toEqual([
      { field: 'destinationPinId', before: 'V1-2', after: null },
    ]);
  });

  it('reports feeds added, removed and changed', () => {
    const before = snapshot({ feeds: [{ name: 'Fan', fuseA: 30 }, { name: 'Pump' }] });
    const after = structuredClone(before);
    after.feeds[0]!.fuseA = 25;
    after.feeds.splice(1, 1);
    const d = diffSnapshots(before, after);
    expect(d.feeds.changed).toEqual([
      { name: 'Fan', feedId: 1, fields: [{ field: 'fuseA', before: 30, after: 25 }] },
    ]);
    expect(d.feeds.removed).toEqual([{ name: 'Pump', feedId: 2 }]);
  });
});
