/**
 * The published sources the electrical calculations rest on. Every result names the ids it used,
 * so a finding can show its working and where each number came from.
 */
export const SOURCES = {
  'iacs-copper': {
    title: 'Resistivity of annealed copper',
    citation:
      'IEC 60028 / IEC 60287-1-1 Table 1: annealed copper 0.017241 Ω·mm²/m at 20 °C; α₂₀ = 0.00393 /°C (100 % IACS)',
  },
  'faa-43-13': {
    title: 'Conductor resistance at temperature',
    citation: 'FAA AC 43.13-1B §11-66: R_T = R₂₀ · (234.5 + T) / 254.5',
  },
  'astm-b258': {
    title: 'AWG sizes',
    citation: 'ASTM B258: d = 0.127 mm × 92^((36 − n)/39)',
  },
  'iso-6722': {
    title: 'ISO 6722-1 road-vehicle cables',
    citation:
      "ISO 6722-1 nominal sizes and maximum conductor resistance at 20 °C, as stated by cable makers' datasheets (the standard's own table not read)",
  },
  'sae-j1128': {
    title: 'SAE J1128 insulation ratings',
    citation: 'SAE J1128: GPT 85 °C (PVC), TWP 105 °C, TXL / GXL / SXL 125 °C (XLPE)',
  },
  'sae-j1128-area': {
    title: 'SAE J1128 minimum conductor areas',
    citation:
      "SAE J1128 minimum areas of automotive AWG cable, circular mils: 18 → 1537, 16 → 2336, 14 → 3702, 12 → 5833, 10 → 9343, 8 → 14810, 6 → 24538, 4 → 37360 (as reprinted in wire makers' catalogue appendices)",
  },
  'faa-43-13-temp': {
    title: 'Conductor temperature under load',
    citation:
      'FAA AC 43.13-1B ¶11-66: T = T_ambient + (T_rating − T_ambient) · (I / I_max)², I_max the allowable current at the insulation rating',
  },
  'uscg-183-425': {
    title: 'Allowable amperage of conductors',
    citation:
      '33 CFR 183.425 Table 5: ampacity by AWG (18 … 4/0) and insulation rating, 30 °C ambient; note 1: engine-space correction factors (75 °C 0.75, 80 °C 0.78, 90 °C 0.82, 105 °C 0.85, 125 °C 0.89, 200 °C 1.00, after ABYC E-11 Table VI-B)',
  },
  'uscg-183-435': {
    title: 'Bundled conductors',
    citation:
      '33 CFR 183.435(b) and Table 5 note 2: bundle factors 3 → 0.70, 4–6 → 0.60, 7–24 → 0.50, 25+ → 0.40, required at 50 V or more',
  },
  'uscg-183-455': {
    title: 'Overcurrent protection (marine)',
    citation:
      '33 CFR 183.455: (b) the fuse within 7 in (178 mm) of the source, 40 in (1,016 mm) if the conductor is sheathed; (c) a device up to 150 % of Table 5 below 50 V. A marine rule, borrowed for vehicles by analogy',
  },
  'nec-210-20': {
    title: 'Fuse sized for the load',
    citation:
      'NEC 210.20(A): rating ≥ 125 % of the continuous load plus the non-continuous load (the inverse of 80 % loading)',
  },
  'nec-240-4': {
    title: 'Fuse protects the wire',
    citation: "NEC 240.4: the protective device does not exceed the conductor's ampacity",
  },
  'abyc-e11': {
    title: 'Voltage-drop limits',
    citation:
      'ABYC E-11 voltage-drop limits: 3 % where drop must be kept to a minimum, 10 % for non-critical circuits',
  },
  'iso-8820-3': {
    title: 'Blade fuses',
    citation:
      "ISO 8820-3 blade-fuse ratings; colours from industry charts (the standard's own table not read)",
  },
  'iso-11898-2': {
    title: 'High-speed CAN bus',
    citation:
      'ISO 11898-2 (high-speed CAN): a 120 Ω termination at each end of the bus, so about 60 Ω across CAN-H and CAN-L with the power off; the pair twisted; stubs short',
  },
  'sae-j1962': {
    title: 'Diagnostic connector',
    citation:
      'SAE J1962 16-pin diagnostic connector: 4 chassis ground, 5 signal ground, 6 CAN high, 14 CAN low, 7 K-line, 15 L-line, 2 and 10 SAE J1850 bus + and −, 16 battery + (unswitched)',
  },
  'from-memory': {
    title: 'From memory',
    citation: 'From memory: not verified at a published source',
  },
  'common-practice': {
    title: 'Common practice',
    citation: 'Common practice, no single published source',
  },
} as const satisfies Record<string, { title: string; citation: string }>;

export type SourceId = keyof typeof SOURCES;

export interface SourceRef {
  id: SourceId;
  title: string;
  citation: string;
}

/** The ids without repeats, first use first. */
export function uniqueSourceIds(ids: readonly SourceId[]): SourceId[] {
  return [...new Set(ids)];
}

/** Ids expanded to what a reader sees, without repeats. */
export function citeSources(ids: readonly SourceId[]): SourceRef[] {
  return uniqueSourceIds(ids).map((id) => ({ id, ...SOURCES[id] }));
}
