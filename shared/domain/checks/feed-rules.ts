/** Rules for each new fused feed: fuse, wire, load, relay and voltage drop. */
import type { Finding } from '../../schemas/checks.schema.ts';
import type { SnapshotFeed } from '../../schemas/snapshot.schema.ts';
import { wireAmpacity, type WireAmpacity } from '../electrical/ampacity.ts';
import { AMBIENT_C, estimateConductorTemp } from '../electrical/conductor-temperature.ts';
import {
  DEFAULT_CONNECTIONS,
  DEFAULT_DROP_ALLOWANCES,
  dropBudget,
  dropBudgetWorking,
} from '../electrical/drop-budget.ts';
import {
  DEFAULT_FUSE_TYPE,
  familyForLoad,
  FUSE_FAMILIES,
  fuseColour,
  fuseNeededA,
  fusePlacement,
  fuseProtectsWire,
  largestFuseFor,
  recommendedFuseA,
  smallestWireForFuse,
  type FuseType,
} from '../electrical/fuses.ts';
import { FLOAT_SLACK } from '../electrical/guards.ts';
import {
  coilCurrentA,
  contactRatingNeededA,
  INRUSH_ALLOWANCE,
  outputCarries,
} from '../electrical/relays.ts';
import { DROP_LIMIT_PCT, minSizeForDrop, voltageDrop } from '../electrical/voltage-drop.ts';
import { formatAwgGauge } from '../wire-sizes.ts';
import { finding, fmt, value, type CheckContext } from './check-context.ts';

const ZONE_WORDS = { cabin: 'outside the engine bay', engine_bay: 'in the engine bay' } as const;

export function ampacityOf(
  areaMm2: number,
  insulationRatingC: number,
  feed: SnapshotFeed,
): WireAmpacity {
  return wireAmpacity({
    areaMm2,
    insulationRatingC,
    zone: feed.wire.zone,
    bundled: feed.wire.bundled,
    // Three or more current-carrying conductors together: the USCG bundle factors, a conservative
    // choice at 12 V (33 CFR 183.435 requires them only at 50 V or more); the result says so.
    applyBundleDerating: feed.wire.bundled >= 3,
  });
}

/** The family of a feed's fuse; a feed recorded before families were kept has a standard blade. */
export const fuseTypeOf = (feed: Pick<SnapshotFeed, 'fuseType'>): FuseType =>
  feed.fuseType ?? DEFAULT_FUSE_TYPE;

/**
 * The temperature a feed's conductor runs at: the ambient Table 5 assumes for its zone plus the
 * rise its load causes (FAA AC 43.13-1B ¶11-66), worked against the same derated ampacity the fuse
 * is checked with.
 */
export function feedConductorTemp(feed: SnapshotFeed, areaMm2: number, currentA: number) {
  const rating = ampacityOf(areaMm2, feed.wire.insulationRatingC, feed);
  return estimateConductorTemp({
    ambientC: AMBIENT_C[feed.wire.zone],
    insulationRatingC: feed.wire.insulationRatingC,
    currentA,
    ampacityA: rating.ampacityA,
  });
}

function ampacityWorking(
  ctx: CheckContext,
  areaMm2: number,
  rating: WireAmpacity,
  feed: SnapshotFeed,
): string[] {
  return [
    `${ctx.size(areaMm2)} is rated by the ${formatAwgGauge(rating.tableAwg)} AWG row of 33 CFR 183.425 Table 5, ${rating.insulationColumnC} °C column: ${rating.tableAmpacityA} A` +
      (rating.baseAmpacityA !== rating.tableAmpacityA
        ? `, scaled by area to ${fmt(rating.baseAmpacityA)} A`
        : ''),
    ...(feed.wire.zone === 'engine_bay'
      ? [
          `In the engine bay × ${rating.engineSpaceFactor} (Table 5 note 1) → ${fmt(rating.ampacityA)} A`,
        ]
      : []),
    ...rating.notes,
  ];
}

export function checkFeed(ctx: CheckContext, feed: SnapshotFeed): Finding[] {
  const findings: Finding[] = [];
  const subject = { feedId: feed.id };
  const fuse = ctx.protectingFuse(feed);
  const current = ctx.current(feed);

  // A feed straight from the battery or ignition with no fuse anywhere upstream.
  if (!fuse) {
    findings.push(
      finding({
        rule: 'unfused_feed',
        severity: 'error',
        subject,
        title: 'Feed without a fuse',
        message: `"${feed.name}" takes power from the ${feed.source === 'ignition' ? 'ignition switch' : 'battery'} with no fuse upstream. A feed without a fuse is a fire risk: fit a fuse near the source.`,
        values: { fuseA: value('Fuse', null, 'A') },
        working: ['No fuse on this feed or on any feed up its chain of relay outputs.'],
        sourceIds: ['nec-240-4', 'uscg-183-455'],
      }),
    );
  }

  // The fuse sits near its source: the unfused length is where a chafed wire burns.
  if (feed.fuseA != null && feed.unfusedLengthMm != null) {
    const sheathed = feed.fuseSheathed ?? false;
    const placement = fusePlacement(feed.unfusedLengthMm, sheathed);
    if (!placement.withinLimit) {
      findings.push(
        finding({
          rule: 'fuse_placement',
          severity: 'error',
          subject,
          title: 'Fuse too far from its source',
          message: `The fuse of "${feed.name}" sits ${fmt(feed.unfusedLengthMm, 0)} mm of wire from its source; at most ${placement.limitMm} mm${sheathed ? ' for a sheathed run' : ' (1,016 mm if the run is sheathed)'}. Move the fuse closer to the ${feed.source === 'relay_output' ? 'relay' : 'battery or switch'}: an unfused length that chafes through is a fire no fuse can stop.`,
          values: {
            unfusedLengthMm: value('Unfused length', feed.unfusedLengthMm, 'mm', 0),
            limitMm: value('Limit', placement.limitMm, 'mm', 0),
            sheathed: value('Sheathed', sheathed),
          },
          working: [
            `${fmt(feed.unfusedLengthMm, 0)} mm > ${placement.limitMm} mm`,
            '33 CFR 183.455(b): within 7 in (178 mm) of the source, 40 in (1,016 mm) where the conductor is sheathed. A marine rule, borrowed for vehicles by analogy; local rules may ask for more.',
          ],
          sourceIds: ['uscg-183-455'],
        }),
      );
    }
  }

  // The fuse protects the wire.
  const rating = ampacityOf(feed.wire.sizeMm2, feed.wire.insulationRatingC, feed);
  if (fuse && !fuseProtectsWire(fuse.fuseA, rating.ampacityA)) {
    const suggestion = smallestWireForFuse({
      fuseA: fuse.fuseA,
      insulationRatingC: feed.wire.insulationRatingC,
      zone: feed.wire.zone,
      bundled: feed.wire.bundled,
      series: ctx.options.sizeUnit,
      allowExtrapolated: false,
    });
    const maxFuse = largestFuseFor(
      rating.ampacityA,
      fuseTypeOf(ctx.feeds.get(fuse.feedId) ?? feed),
    );
    // A smaller fuse is only an alternative if it still carries the load.
    const neededA = fuseNeededA(current.continuousA, current.nonContinuousA);
    const smallerFuseWorks = maxFuse !== null && maxFuse < fuse.fuseA && maxFuse >= neededA;
    const inherited =
      fuse.feedId !== feed.id ? ` (the fuse of "${ctx.feeds.get(fuse.feedId)?.name}")` : '';
    findings.push(
      finding({
        rule: 'fuse_protects_wire',
        severity: 'error',
        subject,
        title: 'Fuse does not protect the wire',
        message:
          `The ${fmt(fuse.fuseA)} A fuse${inherited} of "${feed.name}" is larger than its ${ctx.size(feed.wire.sizeMm2)} wire can carry ${ZONE_WORDS[feed.wire.zone]} (${fmt(rating.ampacityA, 1)} A): the wire can overheat before the fuse blows.` +
          (suggestion
            ? ` Use at least ${ctx.size(suggestion.areaMm2)} wire`
            : ' No listed wire size is enough') +
          (smallerFuseWorks
            ? `, or a ${fmt(maxFuse!)} A fuse, which still carries the load.`
            : '.'),
        values: {
          fuseA: value('Fuse', fuse.fuseA, 'A'),
          ampacityA: value('Wire ampacity, derated', rating.ampacityA, 'A', 1),
          wireSize: value('Wire size', ctx.size(feed.wire.sizeMm2)),
          tableAwg: value('Table 5 row', `${formatAwgGauge(rating.tableAwg)} AWG`),
          deratingFactor: value('Derating factor', rating.deratingFactor, undefined, 3),
          suggestedSize: value(
            'Smallest wire this fuse protects',
            suggestion ? ctx.size(suggestion.areaMm2) : null,
          ),
        },
        working: [
          ...ampacityWorking(ctx, feed.wire.sizeMm2, rating, feed),
          `${fmt(fuse.fuseA)} A > ${fmt(rating.ampacityA, 1)} A: the fuse does not protect the wire.`,
        ],
        sourceIds: [...rating.sources, 'nec-240-4'],
      }),
    );
  }

  // The fuse suits the load.
  if (current.totalA <= 0) {
    findings.push(
      finding({
        rule: 'feed_without_loads',
        severity: 'warning',
        subject,
        title: 'Feed has no loads',
        message: `"${feed.name}" lists no loads, so its fuse, relay and voltage drop cannot be checked against them.`,
        values: {},
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  } else if (fuse) {
    const fuseType = fuseTypeOf(ctx.feeds.get(fuse.feedId) ?? feed);
    const family = FUSE_FAMILIES[fuseType];
    const neededA = fuseNeededA(current.continuousA, current.nonContinuousA);
    const recommended = recommendedFuseA(current.continuousA, current.nonContinuousA, fuseType);
    const elsewhere =
      recommended === null ? familyForLoad(current.continuousA, current.nonContinuousA) : null;
    const loadValues = {
      fuseA: value('Fuse', fuse.fuseA, 'A'),
      fuseType: value('Fuse type', family.label),
      continuousA: value('Continuous load', current.continuousA, 'A'),
      nonContinuousA: value('Non-continuous load', current.nonContinuousA, 'A'),
      neededA: value('Fuse needed (125 % of continuous + non-continuous)', neededA, 'A'),
      recommendedFuseA: value(`Recommended ${family.label.toLowerCase()}`, recommended, 'A'),
    };
    const colour = recommended === null ? null : fuseColour(recommended, fuseType);
    const loadWorking = [
      `Loads on this fuse: ${fmt(current.continuousA)} A continuous + ${fmt(current.nonContinuousA)} A non-continuous` +
        (current.feedIds.length > 1 ? ` (including the feeds its relay powers)` : ''),
      `1.25 × ${fmt(current.continuousA)} A + ${fmt(current.nonContinuousA)} A = ${fmt(neededA)} A`,
      recommended !== null
        ? `Smallest ${family.label.toLowerCase()} ≥ ${fmt(neededA)} A: ${recommended} A${colour ? ` (${colour})` : ''}`
        : family.ratings.length === 0
          ? `${family.label}: checked at the rating its maker states.`
          : `More than the largest ${family.label.toLowerCase()} (${family.ratings.at(-1)!.ratingA} A)` +
            (elsewhere
              ? `: a ${elsewhere.ratingA} A ${FUSE_FAMILIES[elsewhere.type].label.toLowerCase()} would do.`
              : '.'),
    ];
    if (fuse.fuseA < neededA * (1 - FLOAT_SLACK)) {
      const fix =
        recommended !== null
          ? `a ${recommended} A fuse`
          : elsewhere
            ? `a ${elsewhere.ratingA} A ${FUSE_FAMILIES[elsewhere.type].label.toLowerCase()}`
            : 'a larger fuse than any listed';
      findings.push(
        finding({
          rule: 'load_within_fuse',
          severity: 'error',
          subject,
          title: 'Load too big for the fuse',
          message: `"${feed.name}" draws ${fmt(current.totalA)} A (${fmt(current.continuousA)} A continuous); a ${fmt(fuse.fuseA)} A fuse would blow or run hot. It needs at least ${fmt(neededA)} A: ${fix}, with wire to match.`,
          values: loadValues,
          working: loadWorking,
          sourceIds: ['nec-210-20', ...family.sources, 'common-practice'],
        }),
      );
    } else if (recommended !== null && fuse.fuseA > recommended && fuse.feedId === feed.id) {
      findings.push(
        finding({
          rule: 'fuse_larger_than_load_needs',
          severity: 'note',
          subject,
          title: 'Fuse larger than the load needs',
          message: `"${feed.name}" would be served by a ${recommended} A fuse; the ${fmt(fuse.fuseA)} A fitted lets a fault draw more current before it blows. Fine while it still protects the wire.`,
          values: loadValues,
          working: loadWorking,
          sourceIds: ['nec-210-20', ...family.sources, 'common-practice'],
        }),
      );
    }
  }

  // The relay's contacts carry the load, with room for a motor's or a lamp's inrush.
  if (feed.relay) {
    const loads = current.feedIds.flatMap((id) => ctx.feeds.get(id)?.loads ?? []);
    const neededA = contactRatingNeededA(loads);
    const inrush = loads.filter((l) => (l.kind ?? 'resistive') !== 'resistive');
    if (neededA > feed.relay.contactRatingA * (1 + FLOAT_SLACK)) {
      findings.push(
        finding({
          rule: 'relay_contact_load',
          severity: 'error',
          subject,
          title: 'Load too big for the relay',
          message:
            `"${feed.name}" puts ${fmt(current.totalA)} A through relay contacts rated ${fmt(feed.relay.contactRatingA)} A` +
            (inrush.length
              ? `; with the switch-on surge of its ${inrush.map((l) => l.kind).join(' and ')} load${inrush.length > 1 ? 's' : ''} the contacts need ${fmt(neededA)} A.`
              : '.') +
            ' Use a relay rated for the load.',
          values: {
            totalA: value('Load through the contacts', current.totalA, 'A'),
            neededA: value('Contact rating needed', neededA, 'A'),
            contactRatingA: value('Contact rating', feed.relay.contactRatingA, 'A'),
          },
          working: [
            ...loads.map(
              (l) =>
                `${l.name || 'load'}: ${fmt(l.currentA)} A × ${INRUSH_ALLOWANCE[l.kind ?? 'resistive']} (${l.kind ?? 'resistive'})`,
            ),
            `${fmt(neededA)} A > ${fmt(feed.relay.contactRatingA)} A`,
            'Inrush allowance: motor × 2, lamp × 3 (common practice, no source); a relay maker’s own motor or lamp rating comes first.',
          ],
          sourceIds: ['common-practice'],
        }),
      );
    }

    // The ECU output that drives the coil can carry the coil current.
    const driver = feed.relay.coilPinId != null ? ctx.pins.get(feed.relay.coilPinId) : undefined;
    const coilA =
      feed.relay.coilResistanceOhm != null
        ? coilCurrentA(ctx.systemV, feed.relay.coilResistanceOhm)
        : feed.relay.coilCurrentA;
    if (driver?.driverRatedA != null && !outputCarries(driver.driverRatedA, coilA)) {
      findings.push(
        finding({
          rule: 'relay_coil_driver',
          severity: 'error',
          subject: { feedId: feed.id, pinIds: [driver.id] },
          title: 'Relay coil draws more than its ECU output can switch',
          message: `The relay coil of "${feed.name}" draws ${fmt(coilA, 3)} A; ${ctx.pinName(driver)} (${driver.function || 'ECU output'}) is rated ${fmt(driver.driverRatedA, 3)} A. Use a relay with a higher-resistance coil, or drive it through an intermediate relay.`,
          values: {
            coilA: value('Coil current', coilA, 'A', 3),
            driverRatedA: value('Output rating', driver.driverRatedA, 'A', 3),
          },
          working: [
            feed.relay.coilResistanceOhm != null
              ? `Coil current ${ctx.systemV} V / ${fmt(feed.relay.coilResistanceOhm)} Ω = ${fmt(coilA, 3)} A (Ohm's law)`
              : `Coil current as recorded: ${fmt(coilA, 3)} A`,
            `${fmt(coilA, 3)} A > ${fmt(driver.driverRatedA, 3)} A`,
          ],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }

  // Voltage drop: the whole budget from the source to the load, not the copper alone.
  if (current.totalA > 0) {
    const limitPct = feed.dropLimitPct ?? DROP_LIMIT_PCT[feed.dropClass];
    const temp = feedConductorTemp(feed, feed.wire.sizeMm2, current.totalA);
    const drop = voltageDrop({
      currentA: current.totalA,
      runLengthM: feed.wire.lengthM,
      areaMm2: feed.wire.sizeMm2,
      returnPath: feed.wire.returnPath,
      conductorTempC: temp.conductorTempC,
      systemV: ctx.systemV,
    });
    const path = ctx.pathToSource(feed);
    const upstream = path.slice(1).map((up) => {
      const upCurrentA = ctx.current(up).totalA;
      const upDrop =
        upCurrentA > 0
          ? voltageDrop({
              currentA: upCurrentA,
              runLengthM: up.wire.lengthM,
              areaMm2: up.wire.sizeMm2,
              returnPath: 'chassis',
              conductorTempC: feedConductorTemp(up, up.wire.sizeMm2, upCurrentA).conductorTempC,
              systemV: ctx.systemV,
            }).voltageDropV
          : 0;
      return { name: up.name, copperV: upDrop };
    });
    const allowances = ctx.options.dropAllowances ?? DEFAULT_DROP_ALLOWANCES;
    const budget = dropBudget({
      copperV: drop.voltageDropV,
      upstream,
      fuses: path.flatMap((f) =>
        f.fuseA != null ? [{ ratingA: f.fuseA, currentA: ctx.current(f).totalA }] : [],
      ),
      relays: path.flatMap((f) =>
        f.relay ? [{ ratingA: f.relay.contactRatingA, currentA: ctx.current(f).totalA }] : [],
      ),
      connections: path.reduce((n, f) => n + (f.wire.connections ?? DEFAULT_CONNECTIONS), 0),
      returnPath: feed.wire.returnPath,
      allowances,
      systemV: ctx.systemV,
      limitPct,
    });
    if (!budget.withinLimit) {
      const copperLimitPct = (budget.copperAllowanceV / ctx.systemV) * 100;
      const minSize =
        copperLimitPct > 0
          ? minSizeForDrop({
              currentA: current.totalA,
              runLengthM: feed.wire.lengthM,
              returnPath: feed.wire.returnPath,
              conductorTempFor: (areaMm2) =>
                feedConductorTemp(feed, areaMm2, current.totalA).conductorTempC,
              systemV: ctx.systemV,
              dropLimitPct: copperLimitPct,
              series: ctx.options.sizeUnit,
            })
          : null;
      findings.push(
        finding({
          rule: 'voltage_drop',
          severity: feed.dropClass === 'critical' ? 'error' : 'warning',
          subject,
          title: 'Voltage drop too high',
          message:
            `"${feed.name}" loses ${fmt(budget.totalV)} V (${fmt(budget.totalPct, 1)} % of ${ctx.systemV} V) from its source to its loads at ${fmt(current.totalA)} A, ${fmt(drop.voltageDropV)} V of it in ${fmt(feed.wire.lengthM)} m of ${ctx.size(feed.wire.sizeMm2)}; the limit for a ${feed.dropClass} circuit is ${fmt(limitPct)} %.` +
            (minSize
              ? ` Use at least ${ctx.size(minSize.areaMm2)}.`
              : copperLimitPct > 0
                ? ' No listed size keeps it within the limit: shorten the run.'
                : ' The fuse, relay, terminals and return path alone use up the limit: fewer connections, a shorter path or a closer source.'),
          values: {
            voltageDropV: value('Voltage drop, whole path', budget.totalV, 'V', 3),
            voltageDropPct: value('Voltage drop, whole path', budget.totalPct, '%'),
            copperDropV: value('Of it in this wire', drop.voltageDropV, 'V', 3),
            limitPct: value('Limit', limitPct, '%'),
            currentA: value('Current', current.totalA, 'A'),
            conductorLengthM: value('Conductor length', drop.conductorLengthM, 'm'),
            resistanceOhm: value('Conductor resistance', drop.resistanceOhm, 'Ω', 4),
            conductorTempC: value('Conductor temperature', temp.conductorTempC, '°C', 1),
            suggestedSize: value(
              'Smallest size within the limit',
              minSize ? ctx.size(minSize.areaMm2) : null,
            ),
          },
          working: [
            temp.working,
            ...drop.notes,
            `R = ${fmt(drop.resistanceOhm, 4)} Ω; V = ${fmt(current.totalA)} A × ${fmt(drop.resistanceOhm, 4)} Ω = ${fmt(drop.voltageDropV, 3)} V`,
            ...dropBudgetWorking(budget, ctx.systemV, limitPct),
          ],
          sourceIds: [
            ...drop.sources,
            'faa-43-13-temp',
            ...budget.lines.map((l) => l.source),
            'abyc-e11',
          ],
        }),
      );
    }
  }
  return findings;
}
