/**
 * A connector face draws each cavity's glyph as one path already in place (no transform per
 * cavity): it must be the very drawing the glyph's own path gives, moved and scaled.
 */
import svgpath from 'svgpath';
import { describe, expect, it } from 'vitest';
import { DISPOSITION_INFO, DISPOSITIONS } from '#shared/domain/dispositions.ts';
import { placedGlyph } from '@/components/ui/disposition-glyph.tsx';

const absolute = (d: string) => svgpath(d).abs().unarc().round(2).toString();

describe('a glyph placed on a face', () => {
  it.each(DISPOSITIONS)('%s: the same path as translate(x, y) scale(s) of the glyph', (d) => {
    for (const [x, y, scale] of [
      [0, 0, 1],
      [31, 47, 1.2],
      [1234.5, 6.25, 1.2],
    ] as const) {
      const expected = svgpath(DISPOSITION_INFO[d].glyph).scale(scale).translate(x, y);
      expect(absolute(placedGlyph(d, x, y, scale))).toBe(absolute(expected.toString()));
    }
  });
});
