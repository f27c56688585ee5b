/**
 * Fuses: the families and their ratings, the rating a load needs, whether a fuse protects a wire,
 * and how far from its source it may sit.
 */
import { wireAmpacity, type Zone } from './ampacity.ts';
import { FLOAT_SLACK, requireNonNegative, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';
import { seriesSizes, type SeriesSize, type WireSeries } from './wire-series.ts';

/** The kinds of fuse a feed can be protected by. */
export const FUSE_TYPES = [
  'mini_blade',
  'standard_blade',
  'maxi_blade',
  'bolt_down',
  'fusible_link',
] as const;
export type FuseType = (typeof FUSE_TYPES)[number];
export const DEFAULT_FUSE_TYPE: FuseType = 'standard_blade';

export interface FuseRating {
  ratingA: number;
  /** The housing colour printed on it, null where the family has no colour code. */
  colour: string | null;
  /** True where the rating or colour is from memory, not read at a source. */
  fromMemory: boolean;
}

export interface FuseFamily {
  type: FuseType;
  label: string;
  /** What it is and where it goes, in general words. */
  description: string;
  /** Ratings sold, smallest first; empty where any rating the maker states is taken as given. */
  ratings: readonly FuseRating[];
  sources: readonly SourceId[];
}

const rated = (ratingA: number, colour: string | null, fromMemory = false): FuseRating => ({
  ratingA,
  colour,
  fromMemory,
});

/** Standard blade fuses: ratings and housing colours from industry charts; 35 A from memory. */
const STANDARD_BLADE: readonly FuseRating[] = [
  rated(1, 'black'),
  rated(2, 'grey'),
  rated(3, 'violet'),
  rated(4, 'pink'),
  rated(5, 'tan'),
  rated(7.5, 'brown'),
  rated(10, 'red'),
  rated(15, 'blue'),
  rated(20, 'yellow'),
  rated(25, 'clear/white'),
  rated(30, 'green'),
  rated(35, 'blue-green', true),
  rated(40, 'orange'),
];

/**
 * Every family Loomwright checks. Mini blades share the standard colours over a shorter range;
 * maxi blades have their own colour table (industry charts say so; the values here are from
 * memory); bolt-down strip fuses and fusible links carry no colour code.
 */
export const FUSE_FAMILIES: Readonly<Record<FuseType, FuseFamily>> = {
  mini_blade: {
    type: 'mini_blade',
    label: 'Mini blade fuse',
    description: 'A small plug-in blade fuse for branch circuits, up to 30 A.',
    ratings: STANDARD_BLADE.filter((f) => f.ratingA >= 2 && f.ratingA <= 30).map((f) => ({
      ...f,
      fromMemory: true,
    })),
    sources: ['iso-8820-3', 'from-memory'],
  },
  standard_blade: {
    type: 'standard_blade',
    label: 'Standard blade fuse',
    description: 'The common plug-in blade fuse, 1 to 40 A.',
    ratings: STANDARD_BLADE,
    sources: ['iso-8820-3'],
  },
  maxi_blade: {
    type: 'maxi_blade',
    label: 'Maxi blade fuse',
    description: 'A large plug-in blade fuse for sub-feeds and high-current loads, 20 to 100 A.',
    ratings: [
      rated(20, 'yellow', true),
      rated(30, 'green', true),
      rated(40, 'orange', true),
      rated(50, 'red', true),
      rated(60, 'blue', true),
      rated(70, 'tan', true),
      rated(80, 'clear', true),
      rated(100, 'violet', true),
    ],
    sources: ['from-memory'],
  },
  bolt_down: {
    type: 'bolt_down',
    label: 'Bolt-down strip fuse',
    description:
      'A fusible metal strip bolted between two studs, for a main feed from the battery or alternator.',
    ratings: [40, 50, 60, 70, 80, 100, 125, 150, 175, 200, 225, 250, 300].map((a) =>
      rated(a, null),
    ),
    sources: ['common-practice'],
  },
  fusible_link: {
    type: 'fusible_link',
    label: 'Fusible link',
    description:
      'A short length of special wire, usually four gauges thinner than the wire it protects, that melts open on a lasting fault. Checked at the rating its maker states.',
    ratings: [],
    sources: ['common-practice'],
  },
};

/** Blade-fuse ratings and colours (the standard family), kept for the worksheet legend. */
export const BLADE_FUSES: readonly FuseRating[] = STANDARD_BLADE;
export const BLADE_FUSE_RATINGS_A: readonly number[] = STANDARD_BLADE.map((f) => f.ratingA);

/** The ratings of a family, smallest first. */
export function fuseRatingsA(type: FuseType = DEFAULT_FUSE_TYPE): readonly number[] {
  return FUSE_FAMILIES[type].ratings.map((f) => f.ratingA);
}

/** NEC 210.20(A): a device carries a continuous load at no more than 80 % of its rating. */
export const CONTINUOUS_LOAD_FACTOR = 1.25;

/** Sources behind recommendedFuseA: the 125 % rule and vehicle-work practice (the family adds its own). */
export const RECOMMENDED_FUSE_SOURCES: readonly SourceId[] = ['nec-210-20', 'common-practice'];

/** Sources behind fuseProtectsWire: the rule checked, and the laxer marine rule noted. */
export const FUSE_PROTECTS_WIRE_SOURCES: readonly SourceId[] = ['nec-240-4', 'uscg-183-455'];

/** The printed colour of a rating in a family, or null (no such rating, or no colour code). */
export function fuseColour(ratingA: number, type: FuseType = DEFAULT_FUSE_TYPE): string | null {
  return FUSE_FAMILIES[type].ratings.find((f) => f.ratingA === ratingA)?.colour ?? null;
}

/** True when the family sells that rating; a fusible link takes any rating its maker states. */
export function isStandardFuseRating(ratingA: number, type: FuseType = DEFAULT_FUSE_TYPE): boolean {
  const ratings = fuseRatingsA(type);
  return ratings.length === 0 || ratings.includes(ratingA);
}

/** The rating the load needs: 1.25 × continuous + non-continuous (NEC 210.20(A)). */
export function fuseNeededA(continuousA: number, nonContinuousA = 0): number {
  requireNonNegative('continuousA', continuousA);
  requireNonNegative('nonContinuousA', nonContinuousA);
  return CONTINUOUS_LOAD_FACTOR * continuousA + nonContinuousA;
}

/**
 * The smallest rating of the family ≥ 1.25 × continuous + non-continuous load (NEC 210.20(A);
 * common practice in vehicle work), or null when the load needs more than the family's largest
 * (or the family, a fusible link, has no rating list).
 */
export function recommendedFuseA(
  continuousA: number,
  nonContinuousA = 0,
  type: FuseType = DEFAULT_FUSE_TYPE,
): number | null {
  const neededA = fuseNeededA(continuousA, nonContinuousA);
  if (neededA <= 0) throw new RangeError('a fuse needs a load greater than zero');
  return fuseRatingsA(type).find((r) => r >= neededA * (1 - FLOAT_SLACK)) ?? null;
}

/** The first family, smallest first, that sells a rating for the load: where to look above 40 A. */
export function familyForLoad(
  continuousA: number,
  nonContinuousA = 0,
): { type: FuseType; ratingA: number } | null {
  for (const type of ['standard_blade', 'maxi_blade', 'bolt_down'] as const) {
    const ratingA = recommendedFuseA(continuousA, nonContinuousA, type);
    if (ratingA !== null) return { type, ratingA };
  }
  return null;
}

/** The largest rating of the family a wire's ampacity allows, or null. */
export function largestFuseFor(
  ampacityA: number,
  type: FuseType = DEFAULT_FUSE_TYPE,
): number | null {
  const allowed = fuseRatingsA(type).filter((r) => fuseProtectsWire(r, ampacityA));
  return allowed.length ? allowed[allowed.length - 1]! : null;
}

/**
 * 33 CFR 183.455(b): the fuse within 7 in (178 mm) of the source, or 40 in (1,016 mm) where the
 * conductor is in a sheath or enclosure. A marine rule, borrowed for vehicles by analogy.
 */
export const UNFUSED_LENGTH_LIMIT_MM = { bare: 178, sheathed: 1016 } as const;

export interface FusePlacement {
  limitMm: number;
  withinLimit: boolean;
}

export function fusePlacement(unfusedLengthMm: number, sheathed: boolean): FusePlacement {
  requireNonNegative('unfusedLengthMm', unfusedLengthMm);
  const limitMm = sheathed ? UNFUSED_LENGTH_LIMIT_MM.sheathed : UNFUSED_LENGTH_LIMIT_MM.bare;
  return { limitMm, withinLimit: unfusedLengthMm <= limitMm };
}

/**
 * NEC 240.4: the fuse must not exceed the wire's (derated) ampacity. 33 CFR 183.455(c) would allow
 * up to 150 % of Table 5 below 50 V; Loomwright checks the stricter rule.
 */
export function fuseProtectsWire(fuseA: number, ampacityA: number): boolean {
  requirePositive('fuseA', fuseA);
  requirePositive('ampacityA', ampacityA);
  return fuseA <= ampacityA * (1 + FLOAT_SLACK);
}

export const FUSE_PROTECTS_WIRE_NOTE =
  'The fuse must not exceed the wire’s derated ampacity (NEC 240.4). 33 CFR 183.455(c) would allow up to 150 % of Table 5 below 50 V; Loomwright checks the stricter rule.';

export interface SmallestWireForFuseInput {
  fuseA: number;
  insulationRatingC: number;
  zone: Zone;
  bundled?: number;
  applyBundleDerating?: boolean;
  series: WireSeries;
  /** False to skip sizes rated outside Table 5's rows (thinner than 18 AWG): what to suggest to a builder. */
  allowExtrapolated?: boolean;
}

export interface WireForFuse extends SeriesSize {
  ampacityA: number;
  /** True when that size is rated outside the rows of Table 5 (see wireAmpacity). */
  extrapolated: boolean;
  sources: SourceId[];
}

/** The thinnest size of the series whose derated ampacity is at least the fuse rating, or null. */
export function smallestWireForFuse({
  fuseA,
  series,
  allowExtrapolated = true,
  ...conditions
}: SmallestWireForFuseInput): WireForFuse | null {
  requirePositive('fuseA', fuseA);
  for (const size of seriesSizes(series)) {
    const rating = wireAmpacity({ ...conditions, areaMm2: size.areaMm2 });
    if (rating.extrapolated && !allowExtrapolated) continue;
    if (fuseProtectsWire(fuseA, rating.ampacityA)) {
      return {
        ...size,
        ampacityA: rating.ampacityA,
        extrapolated: rating.extrapolated,
        sources: [...new Set<SourceId>([...rating.sources, 'nec-240-4'])],
      };
    }
  }
  return null;
}
