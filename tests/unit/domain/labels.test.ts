import { describe, expect, it } from 'vitest';
import { labelKey, looseLabelKey } from '../../../shared/domain/labels.ts';

describe('the look-alike key of a label', () => {
  it('reads Cyrillic, Greek and fullwidth look-alikes as their Latin twins', () => {
    expect(labelKey('\u04151')).toBe(labelKey('E1')); // Cyrillic Е
    expect(labelKey('\u03911')).toBe(labelKey('A1')); // Greek Α
    expect(labelKey('\uff25\uff23\uff35')).toBe('ECU'); // fullwidth
    expect(labelKey('\u0421\u0430\u0440')).toBe(labelKey('Cap')); // Cyrillic С, а, р
  });

  it('counts runs of spaces as one and keeps case; the loose key drops case', () => {
    expect(labelKey(' E  1 ')).toBe('E 1');
    expect(labelKey('e1')).not.toBe(labelKey('E1'));
    expect(looseLabelKey('e1')).toBe(looseLabelKey('\u04151'));
  });

  it('keeps labels that read differently apart', () => {
    expect(labelKey('E1')).not.toBe(labelKey('E2'));
    expect(labelKey('A1')).not.toBe(labelKey('A11'));
    expect(labelKey('12')).toBe('12');
  });
});
