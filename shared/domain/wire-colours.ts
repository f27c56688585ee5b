/**
 * Wire insulation colours by their IEC 60757 two-letter codes. A wire is a base colour with an
 * optional stripe, written "BU/WH" (blue with a white stripe). Green-yellow (GNYE) is IEC 60757's
 * combination code and stands alone. The swatch colours are our own on-screen approximations; the
 * code is always shown beside them, never the colour alone.
 */
export const IEC_60757_COLOURS = {
  BK: { name: 'black', swatch: '#1b1b1b' },
  BN: { name: 'brown', swatch: '#7a4a24' },
  RD: { name: 'red', swatch: '#c8262b' },
  OG: { name: 'orange', swatch: '#e9731c' },
  YE: { name: 'yellow', swatch: '#f3cf1f' },
  GN: { name: 'green', swatch: '#2f8a3b' },
  BU: { name: 'blue', swatch: '#2459b8' },
  VT: { name: 'violet', swatch: '#7b3fa6' },
  GY: { name: 'grey', swatch: '#8c8c8c' },
  WH: { name: 'white', swatch: '#f7f7f2' },
  PK: { name: 'pink', swatch: '#ee8fb3' },
  GD: { name: 'gold', swatch: '#c49a2c' },
  TQ: { name: 'turquoise', swatch: '#2bb3b1' },
  SR: { name: 'silver', swatch: '#c0c3c7' },
} as const;

export type ColourCode = keyof typeof IEC_60757_COLOURS;
export const COLOUR_CODES = Object.keys(IEC_60757_COLOURS) as ColourCode[];
export const GREEN_YELLOW = 'GNYE';

export interface WireColour {
  base: ColourCode | typeof GREEN_YELLOW;
  stripe: ColourCode | null;
}

const isCode = (s: string): s is ColourCode => s in IEC_60757_COLOURS;

export type ColourParse =
  { ok: true; value: string; colour: WireColour; note?: string } | { ok: false; error: string };

/**
 * Spellings met in service literature and on wiring sheets, read as IEC 60757 codes (common
 * practice, no source). IEC 60757 has no light or dark shades: "LT GRN" is stored as GN and the
 * parse says so.
 */
const COLOUR_ALIASES: Readonly<Record<string, ColourCode>> = {
  BLK: 'BK',
  BLACK: 'BK',
  BRN: 'BN',
  BROWN: 'BN',
  RED: 'RD',
  ORN: 'OG',
  ORG: 'OG',
  ORANGE: 'OG',
  YEL: 'YE',
  YLW: 'YE',
  YELLOW: 'YE',
  GRN: 'GN',
  GREEN: 'GN',
  BLU: 'BU',
  BLUE: 'BU',
  VIO: 'VT',
  VIOLET: 'VT',
  PPL: 'VT',
  PUR: 'VT',
  PURPLE: 'VT',
  GRY: 'GY',
  GRA: 'GY',
  GREY: 'GY',
  GRAY: 'GY',
  WHT: 'WH',
  WHITE: 'WH',
  PNK: 'PK',
  PINK: 'PK',
  TRQ: 'TQ',
  TURQUOISE: 'TQ',
  GOLD: 'GD',
  SIL: 'SR',
  SILVER: 'SR',
};

/** A shade prefix ("LT", "DK") read off a colour word, with the word left. */
const SHADE = /^(LT|DK)(?=[A-Z]{2,})/;

function readColourWord(word: string): { code: ColourCode; shade: string | null } | null {
  const shade = SHADE.exec(word)?.[1] ?? null;
  const bare = shade ? word.slice(shade.length) : word;
  const code = isCode(bare) ? bare : (COLOUR_ALIASES[bare] ?? null);
  if (code === null) return null;
  return { code, shade: shade === 'LT' ? 'light' : shade === 'DK' ? 'dark' : null };
}

/**
 * Reads a colour as typed or imported into the canonical form "BU/WH": IEC 60757 codes ("bu/wh",
 * "BU-WH", "BU WH") or the common English abbreviations ("BLU/WHT", "LT GRN"). "GN/YE" is green
 * with a yellow stripe, an ordinary vehicle wire; only "GNYE" typed as one word is IEC 60757's
 * green-yellow. An empty string is "no colour recorded".
 */
export function parseWireColour(input: string): ColourParse {
  const text = input
    .trim()
    .toUpperCase()
    .replace(/\bLIGHT\s+/g, 'LT')
    .replace(/\bDARK\s+/g, 'DK')
    .replace(/\b(LT|DK)[.\s]+(?=[A-Z])/g, '$1');
  if (text === GREEN_YELLOW) {
    return { ok: true, value: GREEN_YELLOW, colour: { base: GREEN_YELLOW, stripe: null } };
  }
  const parts = text.split(/\s*[/\-\s]\s*/).filter(Boolean);
  const allowed = `use IEC 60757 codes (${COLOUR_CODES.join(', ')}) or common abbreviations (BLK, BLU, WHT…), a base and an optional stripe like BU/WH`;
  if (parts.length === 0 || parts.length > 2)
    return { ok: false, error: `"${input}" is not a wire colour: ${allowed}` };
  const [baseWord, stripeWord] = parts as [string, string | undefined];
  const base = readColourWord(baseWord);
  if (!base) return { ok: false, error: `"${baseWord}" is not a wire colour: ${allowed}` };
  const stripe = stripeWord === undefined ? null : readColourWord(stripeWord);
  if (stripeWord !== undefined && !stripe) {
    return { ok: false, error: `"${stripeWord}" is not a wire colour: ${allowed}` };
  }
  if (stripe && stripe.code === base.code)
    return { ok: false, error: `a ${base.code} wire cannot have a ${base.code} stripe` };
  const shaded = [base, stripe].filter((c) => c?.shade);
  const note = shaded.length
    ? `IEC 60757 has no ${shaded.map((c) => `${c!.shade} ${IEC_60757_COLOURS[c!.code].name}`).join(' or ')}: stored as ${shaded.map((c) => c!.code).join(', ')}; say the shade in the notes if it matters.`
    : undefined;
  return {
    ok: true,
    value: stripe ? `${base.code}/${stripe.code}` : base.code,
    colour: { base: base.code, stripe: stripe?.code ?? null },
    ...(note ? { note } : {}),
  };
}

/** Swatch colours of a canonical colour value, base first; empty for no colour. */
export function colourSwatches(value: string): string[] {
  const parsed = value ? parseWireColour(value) : null;
  if (!parsed || !parsed.ok) return [];
  if (parsed.colour.base === GREEN_YELLOW)
    return [IEC_60757_COLOURS.GN.swatch, IEC_60757_COLOURS.YE.swatch];
  const { base, stripe } = parsed.colour;
  return stripe
    ? [IEC_60757_COLOURS[base].swatch, IEC_60757_COLOURS[stripe].swatch]
    : [IEC_60757_COLOURS[base].swatch];
}

/** "blue with white stripe", for screen readers and print legends. */
export function describeWireColour(value: string): string {
  const parsed = value ? parseWireColour(value) : null;
  if (!parsed || !parsed.ok) return 'no colour recorded';
  if (parsed.colour.base === GREEN_YELLOW) return 'green-yellow';
  const { base, stripe } = parsed.colour;
  const baseName = IEC_60757_COLOURS[base].name;
  return stripe ? `${baseName} with ${IEC_60757_COLOURS[stripe].name} stripe` : baseName;
}
