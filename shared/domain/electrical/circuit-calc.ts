/**
 * The stateless circuit calculator: one load on one run of wire, with its working and sources.
 */
import type { CalcRequest } from '../../schemas/calc.schema.ts';
import { storedAwgAreaMm2, formatAwgGauge } from '../wire-sizes.ts';
import { wireAmpacity, type Table5Awg } from './ampacity.ts';
import { AMBIENT_C, estimateConductorTemp } from './conductor-temperature.ts';
import {
  CONTINUOUS_LOAD_FACTOR,
  familyForLoad,
  FUSE_FAMILIES,
  FUSE_PROTECTS_WIRE_NOTE,
  FUSE_PROTECTS_WIRE_SOURCES,
  fuseColour,
  fuseProtectsWire,
  isStandardFuseRating,
  RECOMMENDED_FUSE_SOURCES,
  recommendedFuseA,
  smallestWireForFuse,
  type WireForFuse,
} from './fuses.ts';
import { citeSources, type SourceId, type SourceRef } from './sources.ts';
import { DROP_LIMIT_PCT, minSizeForDrop, voltageDrop, type SizeForDrop } from './voltage-drop.ts';

/** Bundle factors are a conservative choice below this voltage and required at or above it. */
const BUNDLE_RULE_V = 50;

export interface CircuitCalcResult {
  areaMm2: number;
  sizeLabel: string;
  conductorLengthM: number;
  resistanceOhm: number;
  /** The air around the wire, °C: as given, or the zone's Table 5 ambient. */
  ambientC: number;
  /** The conductor temperature the drop is worked at: as given, or estimated from the load. */
  conductorTempC: number;
  conductorTempEstimated: boolean;
  voltageDropV: number;
  voltageDropPct: number;
  /** Only when dropLimitPct is given. */
  dropWithinLimit?: boolean;
  ampacityA: number;
  tableAwg: Table5Awg;
  tableAmpacityA: number;
  insulationColumnC: number;
  engineSpaceFactor: number;
  bundleFactor: number;
  deratingFactor: number;
  extrapolated: boolean;
  currentWithinAmpacity: boolean;
  /** Only when fuseA is given. */
  fuseProtectsWire?: boolean;
  /** Only when fuseA is given: its printed colour if it is a standard blade rating. */
  fuseColour?: string | null;
  /** For the load taken as continuous, in the request's fuse family; null above its largest. */
  recommendedFuseA: number | null;
  recommendedFuseColour: string | null;
  /** Thinnest wire, in the request's unit, that the given (else the recommended) fuse protects. */
  smallestWireForFuse: WireForFuse | null;
  /** Only when dropLimitPct is given: the thinnest size in each series within the limit. */
  minSizeForDrop?: { mm2: SizeForDrop | null; awg: SizeForDrop | null };
  sources: SourceRef[];
  notes: string[];
}

const round = (n: number, places: number) => Number(n.toFixed(places));

/**
 * Composes the calculations for one circuit. The load is taken as continuous (conservative). Bundle
 * factors apply when the request counts three or more conductors.
 */
export function runCircuitCalc(input: CalcRequest): CircuitCalcResult {
  const series = input.awg !== undefined ? 'awg' : 'mm2';
  const areaMm2 = input.awg !== undefined ? storedAwgAreaMm2(input.awg) : input.sizeMm2;
  if (areaMm2 === undefined) throw new RangeError('give sizeMm2 or awg');
  const sizeLabel = input.awg !== undefined ? `${formatAwgGauge(input.awg)} AWG` : `${areaMm2} mm²`;
  const notes: string[] = [];
  const sources: SourceId[] = [];
  if (input.awg !== undefined) sources.push('astm-b258');
  else sources.push('iso-6722');

  const applyBundleDerating = input.bundled >= 3;
  const wire = {
    insulationRatingC: input.insulationRatingC,
    zone: input.zone,
    bundled: input.bundled,
    applyBundleDerating,
  };
  const rating = wireAmpacity({ ...wire, areaMm2 });

  // The conductor runs warmer than the air around it: ¶11-66, unless the caller measured it.
  const ambientC = input.ambientC ?? AMBIENT_C[input.zone];
  const temperatureOf = (sizeMm2: number) =>
    estimateConductorTemp({
      ambientC,
      insulationRatingC: input.insulationRatingC,
      currentA: input.currentA,
      ampacityA: wireAmpacity({ ...wire, areaMm2: sizeMm2 }).ampacityA,
    });
  const estimate = temperatureOf(areaMm2);
  const conductorTempC = input.conductorTempC ?? estimate.conductorTempC;
  if (input.conductorTempC === undefined) {
    sources.push('faa-43-13-temp');
    notes.push(
      `${estimate.working}; ambient ${ambientC} °C${input.ambientC === undefined ? `, the air Table 5 assumes ${input.zone === 'engine_bay' ? 'in an engine space' : 'outside engine spaces'}` : ''}.`,
    );
  } else {
    notes.push(`Conductor temperature ${conductorTempC} °C as given.`);
  }
  const run = {
    currentA: input.currentA,
    runLengthM: input.lengthM,
    returnPath: input.returnPath,
    systemV: input.systemV,
    awgAreaBasis: input.awgAreaBasis,
  };
  const drop = voltageDrop({ ...run, conductorTempC, areaMm2 });
  notes.push(...drop.notes);
  sources.push(...drop.sources);
  notes.push(...rating.notes);
  sources.push(...rating.sources);
  if (applyBundleDerating && input.systemV >= BUNDLE_RULE_V) {
    notes.push(`At ${input.systemV} V the bundle factor is required, not a choice.`);
  }
  const currentWithinAmpacity = input.currentA <= rating.ampacityA;
  if (!currentWithinAmpacity) {
    notes.push(
      `The load, ${input.currentA} A, exceeds this wire's derated ampacity, ${round(rating.ampacityA, 2)} A.`,
    );
  }

  const family = FUSE_FAMILIES[input.fuseType];
  const recommended =
    family.ratings.length === 0 ? null : recommendedFuseA(input.currentA, 0, input.fuseType);
  const neededA = CONTINUOUS_LOAD_FACTOR * input.currentA;
  const elsewhere = recommended === null ? familyForLoad(input.currentA) : null;
  sources.push(...RECOMMENDED_FUSE_SOURCES, ...family.sources);
  notes.push(
    recommended !== null
      ? `Fuse for the load taken as continuous: ${CONTINUOUS_LOAD_FACTOR} × ${input.currentA} A = ${round(neededA, 2)} A → ${recommended} A, the next ${family.label.toLowerCase()} rating.`
      : family.ratings.length === 0
        ? `The load taken as continuous needs ${CONTINUOUS_LOAD_FACTOR} × ${input.currentA} A = ${round(neededA, 2)} A. ${family.description}`
        : `The load taken as continuous needs ${CONTINUOUS_LOAD_FACTOR} × ${input.currentA} A = ${round(neededA, 2)} A: more than the largest ${family.label.toLowerCase()} (${family.ratings.at(-1)!.ratingA} A)` +
          (elsewhere
            ? `; a ${elsewhere.ratingA} A ${FUSE_FAMILIES[elsewhere.type].label.toLowerCase()} would do.`
            : '.'),
  );

  let givenFuse: Pick<CircuitCalcResult, 'fuseProtectsWire' | 'fuseColour'> = {};
  if (input.fuseA !== undefined) {
    const fuseA = input.fuseA;
    const protects = fuseProtectsWire(fuseA, rating.ampacityA);
    givenFuse = { fuseProtectsWire: protects, fuseColour: fuseColour(fuseA, input.fuseType) };
    sources.push(...FUSE_PROTECTS_WIRE_SOURCES);
    notes.push(
      `${fuseA} A fuse ${protects ? '≤' : '>'} ${round(rating.ampacityA, 2)} A ampacity: ${protects ? 'the fuse protects the wire' : 'the fuse does NOT protect the wire'}. ${FUSE_PROTECTS_WIRE_NOTE}`,
    );
    if (!isStandardFuseRating(fuseA, input.fuseType)) {
      notes.push(`${fuseA} A is not a ${family.label.toLowerCase()} rating; checked as given.`);
    }
    if (fuseA < neededA) {
      notes.push(
        `${fuseA} A is less than 125 % of the load (${round(neededA, 2)} A): it may blow in normal use.`,
      );
    }
  } else if (recommended !== null && !fuseProtectsWire(recommended, rating.ampacityA)) {
    notes.push(
      `A ${recommended} A fuse would not protect this wire (${round(rating.ampacityA, 2)} A): use a thicker wire.`,
    );
  }

  const fuseForWire = input.fuseA ?? recommended;
  const smallest =
    fuseForWire === null ? null : smallestWireForFuse({ ...wire, fuseA: fuseForWire, series });

  let minSizes: CircuitCalcResult['minSizeForDrop'];
  let dropWithinLimit: boolean | undefined;
  if (input.dropLimitPct !== undefined) {
    // Each size tried runs at its own temperature: a thinner wire at the same load runs hotter.
    const conductorTempFor =
      input.conductorTempC === undefined
        ? (sizeMm2: number) => temperatureOf(sizeMm2).conductorTempC
        : () => conductorTempC;
    const limit = { ...run, conductorTempFor, dropLimitPct: input.dropLimitPct };
    minSizes = {
      mm2: minSizeForDrop({ ...limit, series: 'mm2' }),
      awg: minSizeForDrop({ ...limit, series: 'awg' }),
    };
    dropWithinLimit = drop.voltageDropPct <= input.dropLimitPct;
    sources.push('abyc-e11');
    notes.push(
      `Drop ${round(drop.voltageDropPct, 2)} % ${dropWithinLimit ? 'within' : 'over'} the ${input.dropLimitPct} % limit (ABYC E-11 uses ${DROP_LIMIT_PCT.critical} % for critical circuits, ${DROP_LIMIT_PCT.general} % for others).`,
    );
  }

  return {
    areaMm2,
    sizeLabel,
    conductorLengthM: drop.conductorLengthM,
    resistanceOhm: drop.resistanceOhm,
    ambientC,
    conductorTempC,
    conductorTempEstimated: input.conductorTempC === undefined,
    voltageDropV: drop.voltageDropV,
    voltageDropPct: drop.voltageDropPct,
    ...(dropWithinLimit !== undefined && { dropWithinLimit }),
    ampacityA: rating.ampacityA,
    tableAwg: rating.tableAwg,
    tableAmpacityA: rating.tableAmpacityA,
    insulationColumnC: rating.insulationColumnC,
    engineSpaceFactor: rating.engineSpaceFactor,
    bundleFactor: rating.bundleFactor,
    deratingFactor: rating.deratingFactor,
    extrapolated: rating.extrapolated,
    currentWithinAmpacity,
    ...givenFuse,
    recommendedFuseA: recommended,
    recommendedFuseColour: recommended === null ? null : fuseColour(recommended, input.fuseType),
    smallestWireForFuse: smallest,
    ...(minSizes && { minSizeForDrop: minSizes }),
    sources: citeSources(sources),
    notes,
  };
}
