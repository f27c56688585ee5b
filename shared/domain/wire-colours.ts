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
  { ok: true; value: string; colour: WireColour } | { ok: false; error: string };

/**
 * Reads a colour as typed or imported ("bu/wh", "BU-WH", "BU WH", "GNYE") into the canonical form
 * "BU/WH". An empty string is "no colour recorded".
 */
export function parseWireColour(input: string): ColourParse {
  const text = input.trim().toUpperCase();
  if (text === GREEN_YELLOW || text === 'GN/YE' || text === 'GN-YE') {
    return { ok: true, value: GREEN_YELLOW, colour: { base: GREEN_YELLOW, stripe: null } };
  }
  const parts = text.split(/\s*[/\-\s]\s*/).filter(Boolean);
  const allowed = `use IEC 60757 codes (${COLOUR_CODES.join(', ')}), a base and an optional stripe like BU/WH`;
  if (parts.length === 0 || parts.length > 2)
    return { ok: false, error: `"${input}" is not a wire colour: ${allowed}` };
  const [base, stripe] = parts as [string, string | undefined];
  if (!isCode(base))
    return { ok: false, error: `"${base}" is not an IEC 60757 colour code: ${allowed}` };
  if (stripe !== undefined && !isCode(stripe)) {
    return { ok: false, error: `"${stripe}" is not an IEC 60757 colour code: ${allowed}` };
  }
  if (stripe === base) return { ok: false, error: `a ${base} wire cannot have a ${base} stripe` };
  return {
    ok: true,
    value: stripe ? `${base}/${stripe}` : base,
    colour: { base, stripe: stripe ?? null },
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
