import { describe, expect, it } from 'vitest';
import { citeSources, SOURCES } from '#shared/domain/electrical/sources.ts';

describe('source registry', () => {
  it('cites each source by its id, once, in first-use order', () => {
    expect(citeSources(['uscg-183-425', 'iacs-copper', 'uscg-183-425'])).toEqual([
      { id: 'uscg-183-425', ...SOURCES['uscg-183-425'] },
      { id: 'iacs-copper', ...SOURCES['iacs-copper'] },
    ]);
  });

  it('names the standard or regulation in every citation', () => {
    // The values the calculations use appear in the citation a reader sees.
    expect(SOURCES['iacs-copper'].citation).toMatch(/IEC 60028.*0\.017241 Ω·mm²\/m at 20 °C/);
    expect(SOURCES['uscg-183-425'].citation).toMatch(/33 CFR 183\.425 Table 5/);
    expect(SOURCES['uscg-183-455'].citation).toMatch(/33 CFR 183\.455/);
    expect(SOURCES['faa-43-13'].citation).toMatch(/AC 43\.13-1B §11-66/);
    expect(SOURCES['common-practice'].citation).toBe('Common practice, no single published source');
    for (const { title, citation } of Object.values(SOURCES)) {
      expect(title.length).toBeGreaterThan(0);
      expect(citation.length).toBeGreaterThan(10);
    }
  });
});
