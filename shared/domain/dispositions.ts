/**
 * What happens to a pin in the conversion. Every disposition has a word and a glyph, so the grid,
 * the connector face and the black-and-white worksheet never rely on colour. Glyphs are SVG path
 * data in a 10 × 10 box, drawn the same way on screen (SVG) and in the PDF (pdfkit `path`).
 */
export const DISPOSITIONS = [
  'undecided',
  'keep',
  'extend',
  'join',
  'depin',
  'cut',
  'empty',
] as const;
export type Disposition = (typeof DISPOSITIONS)[number];

export interface DispositionInfo {
  label: string;
  /** Up to 6 characters, for tight spaces such as a cavity on the connector face. */
  short: string;
  description: string;
  /** SVG path data in a 10 × 10 box; `filled` glyphs are filled, the rest stroked. */
  glyph: string;
  filled: boolean;
}

export const DISPOSITION_INFO: Record<Disposition, DispositionInfo> = {
  undecided: {
    label: 'Undecided',
    short: '?',
    description: 'Not decided yet. Every pin must be decided before review.',
    // A question mark.
    glyph: 'M3 3.5 Q3 1 5 1 Q7 1 7 3.3 Q7 4.8 5 5.6 L5 7 M5 8.6 L5 9.2',
    filled: false,
  },
  keep: {
    label: 'Keep as is',
    short: 'keep',
    description: 'Stays in the engine harness untouched.',
    // A solid disc.
    glyph: 'M5 1.5 A3.5 3.5 0 1 1 4.99 1.5 Z',
    filled: true,
  },
  extend: {
    label: 'Extend / reroute',
    short: 'ext',
    description: 'Lengthened or rerouted to a new place; same circuit.',
    // An arrow to the right.
    glyph: 'M1 5 L8.5 5 M5.5 2 L8.5 5 L5.5 8',
    filled: false,
  },
  join: {
    label: 'Join to vehicle circuit',
    short: 'join',
    description: 'Connected to a circuit of the receiving vehicle or a new feed.',
    // Two rings linked by a bar.
    glyph: 'M1 5 A2 2 0 1 1 5 5 A2 2 0 1 1 1 5 Z M5 5 A2 2 0 1 1 9 5 A2 2 0 1 1 5 5 Z',
    filled: false,
  },
  depin: {
    label: 'De-pin',
    short: 'depin',
    description: 'Terminal released and removed from the cavity; the wire goes.',
    // A terminal pulled up out of a cavity.
    glyph: 'M5 9 L5 2 M2.5 4.5 L5 2 L7.5 4.5 M2 9 L8 9',
    filled: false,
  },
  cut: {
    label: 'Cut and insulate',
    short: 'cut',
    description: 'Wire cut back and its end insulated; terminal stays in place.',
    // A diagonal cross.
    glyph: 'M2 2 L8 8 M8 2 L2 8',
    filled: false,
  },
  empty: {
    label: 'Empty cavity',
    short: 'empty',
    description: 'No terminal in this cavity.',
    // A hollow ring.
    glyph: 'M5 1.5 A3.5 3.5 0 1 1 4.99 1.5 Z',
    filled: false,
  },
};

/** Dispositions that leave a wire to work on at the bench, in the order a technician works. */
export const BENCH_ORDER: Disposition[] = [
  'depin',
  'cut',
  'extend',
  'join',
  'keep',
  'empty',
  'undecided',
];
