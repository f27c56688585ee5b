import { describe, expect, it } from 'vitest';
import { worksheetFileName } from '#server/modules/worksheets/worksheet.service.ts';

const named = (name: string, id = 7) => ({
  conversion: { id, name, donorEngine: '', receivingVehicle: '', systemVoltage: 12, notes: '' },
});

describe('worksheetFileName', () => {
  it('is ASCII letters, digits and hyphens, with draft or the revision number', () => {
    expect(worksheetFileName(named('Ashby yard truck'), null)).toBe(
      'ashby-yard-truck-draft-worksheet.pdf',
    );
    expect(worksheetFileName(named('Pellow farm flatbed'), { number: 3 })).toBe(
      'pellow-farm-flatbed-rev3-worksheet.pdf',
    );
  });

  it('drops quotes, slashes, line breaks and accents that could break the header', () => {
    expect(worksheetFileName(named('Crème "brûlée"\r\n../../x;.pdf'), null)).toBe(
      'creme-brulee-x-pdf-draft-worksheet.pdf',
    );
  });

  it('falls back to the id when nothing printable is left', () => {
    expect(worksheetFileName(named('مضخة 🚚'), { number: 1 })).toBe(
      'conversion-7-rev1-worksheet.pdf',
    );
  });
});
