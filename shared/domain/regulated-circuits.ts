/**
 * Circuits that are regulated or dangerous where a vehicle is used: emissions, anti-theft and
 * restraint systems. Recognised by the words of a pin's function; flagged in the grid, cautioned
 * on the worksheet and reported when cut or de-pinned, never blocked (common practice, no source).
 */
export interface RegulatedCategory {
  key: 'emissions' | 'anti_theft' | 'restraint';
  label: string;
  caution: string;
}

const CATEGORIES: Array<{ pattern: RegExp; category: RegulatedCategory }> = [
  {
    pattern:
      /\b(purge|evap(orative)?|canister|egr|exhaust gas recirc\w*|secondary air|o2|oxygen|lambda|catalyst)\b/i,
    category: {
      key: 'emissions',
      label: 'Emissions',
      caution: 'It is part of the emissions controls.',
    },
  },
  {
    pattern: /\b(immobili[sz]er|anti-?theft|transponder)\b/i,
    category: {
      key: 'anti_theft',
      label: 'Anti-theft',
      caution: 'It is part of the anti-theft system.',
    },
  },
  {
    pattern: /\b(airbag|srs|restraint|pretensioner)\b/i,
    category: {
      key: 'restraint',
      label: 'Restraint',
      caution: 'It is part of the airbag and restraint system: leave it to the maker’s procedure.',
    },
  },
];

/** The regulated kind a pin's function names, or null. */
export function regulatedCategory(fn: string): RegulatedCategory | null {
  return CATEGORIES.find((c) => c.pattern.test(fn))?.category ?? null;
}
