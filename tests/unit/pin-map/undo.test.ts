import { describe, expect, it } from 'vitest';
import { pinsById } from '../../../src/features/pin-map/lib/pin-cache.ts';
import {
  dropUndo,
  popUndo,
  pushUndo,
  undoEdits,
  undoEntryFor,
} from '../../../src/features/pin-map/lib/undo.ts';
import { pin } from './fixtures.ts';

const pins = pinsById([
  pin({ id: 1, colour: 'RD', disposition: 'keep' }),
  pin({ id: 2, colour: '', disposition: 'undecided' }),
]);

describe('the undo history', () => {
  it('records the values each edit replaces', () => {
    const entry = undoEntryFor('a', 'paste into 2 pins', pins, [
      { id: 1, set: { colour: 'BK' } },
      { id: 2, set: { colour: 'BU/WH', disposition: 'join' } },
    ]);
    expect(entry.changes).toEqual([
      { id: 1, before: { colour: 'RD' }, after: { colour: 'BK' } },
      {
        id: 2,
        before: { colour: '', disposition: 'undecided' },
        after: { colour: 'BU/WH', disposition: 'join' },
      },
    ]);
    expect(undoEdits(entry)).toEqual([
      { id: 1, set: { colour: 'RD' } },
      { id: 2, set: { colour: '', disposition: 'undecided' } },
    ]);
  });

  it('undoes the newest change first', () => {
    const first = undoEntryFor('a', 'colour of E1-1', pins, [{ id: 1, set: { colour: 'BK' } }]);
    const second = undoEntryFor('b', 'colour of E1-2', pins, [{ id: 2, set: { colour: 'GN' } }]);
    const stack = pushUndo(pushUndo([], first), second);
    const popped = popUndo(stack);
    expect(popped?.entry.id).toBe('b');
    expect(popUndo(popped!.rest)?.entry.id).toBe('a');
    expect(popUndo([])).toBeNull();
  });

  it('forgets a change the server refused, and keeps at most the limit', () => {
    const entries = ['a', 'b', 'c'].map((id) =>
      undoEntryFor(id, id, pins, [{ id: 1, set: { notes: id } }]),
    );
    const stack = entries.reduce((s, e) => pushUndo(s, e, 2), [] as ReturnType<typeof pushUndo>);
    expect(stack.map((e) => e.id)).toEqual(['b', 'c']);
    expect(dropUndo(stack, 'c').map((e) => e.id)).toEqual(['b']);
  });

  it('records nothing for edits of pins it does not know', () => {
    const entry = undoEntryFor('x', 'x', pins, [{ id: 99, set: { notes: 'x' } }]);
    expect(pushUndo([], entry)).toEqual([]);
  });
});
