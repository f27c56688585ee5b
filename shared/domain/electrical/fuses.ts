/**
 * Fuses: the standard blade ratings, the rating a load needs, and whether a fuse protects a wire.
 */
import { wireAmpacity, type Zone } from './ampacity.ts';
import { FLOAT_SLACK, requireNonNegative, requirePositive } from './guards.ts';
import type { SourceId } from './sources.ts';
import { seriesSizes, type SeriesSize, type WireSeries } from './wire-series.ts';

export interface BladeFuse {
  ratingA: number;
  /** The housing colour printed by industry charts (ISO 8820-3's own table not read). */
  colour: string;
  /** True where the colour is from memory, not read at a source. */
  fromMemory: boolean;
}

/** Blade-fuse ratings and housing colours, from industry charts; 35 A blue-green from memory. */
export const BLADE_FUSES: readonly BladeFuse[] = [
  { ratingA: 1, colour: 'black', fromMemory: false },
  { ratingA: 2, colour: 'grey', fromMemory: false },
  { ratingA: 3, colour: 'violet', fromMemory: false },
  { ratingA: 4, colour: 'pink', fromMemory: false },
  { ratingA: 5, colour: 'tan', fromMemory: false },
  { ratingA: 7.5, colour: 'brown', fromMemory: false },
  { ratingA: 10, colour: 'red', fromMemory: false },
  { ratingA: 15, colour: 'blue', fromMemory: false },
  { ratingA: 20, colour: 'yellow', fromMemory: false },
  { ratingA: 25, colour: 'clear/white', fromMemory: false },
  { ratingA: 30, colour: 'green', fromMemory: false },
  { ratingA: 35, colour: 'blue-green', fromMemory: true },
  { ratingA: 40, colour: 'orange', fromMemory: false },
];

export const BLADE_FUSE_RATINGS_A: readonly number[] = BLADE_FUSES.map((f) => f.ratingA);

/** NEC 210.20(A): a device carries a continuous load at no more than 80 % of its rating. */
export const CONTINUOUS_LOAD_FACTOR = 1.25;

/** Sources behind recommendedFuseA: the 125 % rule, the blade ratings, vehicle-work practice. */
export const RECOMMENDED_FUSE_SOURCES: readonly SourceId[] = [
  'nec-210-20',
  'iso-8820-3',
  'common-practice',
];

/** Sources behind fuseProtectsWire: the rule checked, and the laxer marine rule noted. */
export const FUSE_PROTECTS_WIRE_SOURCES: readonly SourceId[] = ['nec-240-4', 'uscg-183-455'];

/** The printed colour of a standard blade rating, or null for a rating that is not one. */
export function fuseColour(ratingA: number): string | null {
  return BLADE_FUSES.find((f) => f.ratingA === ratingA)?.colour ?? null;
}

export function isStandardFuseRating(ratingA: number): boolean {
  return BLADE_FUSE_RATINGS_A.includes(ratingA);
}

/**
 * The smallest standard blade rating ≥ 1.25 × continuous + non-continuous load (NEC 210.20(A);
 * common practice in vehicle work), or null when the load needs more than 40 A.
 */
export function recommendedFuseA(continuousA: number, nonContinuousA = 0): number | null {
  requireNonNegative('continuousA', continuousA);
  requireNonNegative('nonContinuousA', nonContinuousA);
  const neededA = CONTINUOUS_LOAD_FACTOR * continuousA + nonContinuousA;
  if (neededA <= 0) throw new RangeError('a fuse needs a load greater than zero');
  return BLADE_FUSE_RATINGS_A.find((r) => r >= neededA * (1 - FLOAT_SLACK)) ?? null;
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
