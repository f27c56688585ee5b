/** Rules for each new fused feed: fuse, wire, load, relay and voltage drop. */
import type { Finding } from '../../schemas/checks.schema.ts';
import type { SnapshotFeed } from '../../schemas/snapshot.schema.ts';
import { wireAmpacity, type WireAmpacity } from '../electrical/ampacity.ts';
import {
  BLADE_FUSE_RATINGS_A,
  CONTINUOUS_LOAD_FACTOR,
  fuseColour,
  fuseProtectsWire,
  recommendedFuseA,
  smallestWireForFuse,
} from '../electrical/fuses.ts';
import { FLOAT_SLACK } from '../electrical/guards.ts';
import { DROP_LIMIT_PCT, minSizeForDrop, voltageDrop } from '../electrical/voltage-drop.ts';
import { CONDUCTOR_TEMP_C, finding, fmt, value, type CheckContext } from './check-context.ts';

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

/** The largest standard blade fuse the wire's ampacity allows, or null. */
function largestFuseFor(ampacityA: number): number | null {
  const allowed = BLADE_FUSE_RATINGS_A.filter((r) => fuseProtectsWire(r, ampacityA));
  return allowed.length ? allowed[allowed.length - 1]! : null;
}

function ampacityWorking(
  ctx: CheckContext,
  areaMm2: number,
  rating: WireAmpacity,
  feed: SnapshotFeed,
): string[] {
  return [
    `${ctx.size(areaMm2)} is rated by the ${rating.tableAwg} AWG row of 33 CFR 183.425 Table 5, ${rating.insulationColumnC} °C column: ${rating.tableAmpacityA} A` +
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
    const maxFuse = largestFuseFor(rating.ampacityA);
    // A smaller fuse is only an alternative if it still carries the load.
    const neededA = CONTINUOUS_LOAD_FACTOR * current.continuousA + current.nonContinuousA;
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
          tableAwg: value('Table 5 row', `${rating.tableAwg} AWG`),
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
    const neededA = CONTINUOUS_LOAD_FACTOR * current.continuousA + current.nonContinuousA;
    const recommended = recommendedFuseA(current.continuousA, current.nonContinuousA);
    const loadValues = {
      fuseA: value('Fuse', fuse.fuseA, 'A'),
      continuousA: value('Continuous load', current.continuousA, 'A'),
      nonContinuousA: value('Non-continuous load', current.nonContinuousA, 'A'),
      neededA: value('Fuse needed (125 % of continuous + non-continuous)', neededA, 'A'),
      recommendedFuseA: value('Recommended standard fuse', recommended, 'A'),
    };
    const loadWorking = [
      `Loads on this fuse: ${fmt(current.continuousA)} A continuous + ${fmt(current.nonContinuousA)} A non-continuous` +
        (current.feedIds.length > 1 ? ` (including the feeds its relay powers)` : ''),
      `1.25 × ${fmt(current.continuousA)} A + ${fmt(current.nonContinuousA)} A = ${fmt(neededA)} A`,
      recommended
        ? `Smallest standard blade fuse ≥ ${fmt(neededA)} A: ${recommended} A (${fuseColour(recommended)})`
        : 'More than the largest standard blade fuse (40 A).',
    ];
    if (fuse.fuseA < neededA * (1 - FLOAT_SLACK)) {
      findings.push(
        finding({
          rule: 'load_within_fuse',
          severity: 'error',
          subject,
          title: 'Load too big for the fuse',
          message: `"${feed.name}" draws ${fmt(current.totalA)} A (${fmt(current.continuousA)} A continuous); a ${fmt(fuse.fuseA)} A fuse would blow or run hot. It needs at least ${fmt(neededA)} A: ${recommended ? `a ${recommended} A fuse` : 'more than a blade fuse'}, with wire to match.`,
          values: loadValues,
          working: loadWorking,
          sourceIds: ['nec-210-20', 'common-practice'],
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
          sourceIds: ['nec-210-20', 'common-practice'],
        }),
      );
    }
  }

  // The relay's contacts carry the load.
  if (feed.relay && current.totalA > feed.relay.contactRatingA * (1 + FLOAT_SLACK)) {
    findings.push(
      finding({
        rule: 'relay_contact_load',
        severity: 'error',
        subject,
        title: 'Load too big for the relay',
        message: `"${feed.name}" puts ${fmt(current.totalA)} A through relay contacts rated ${fmt(feed.relay.contactRatingA)} A. Use a relay rated for the load.`,
        values: {
          totalA: value('Load through the contacts', current.totalA, 'A'),
          contactRatingA: value('Contact rating', feed.relay.contactRatingA, 'A'),
        },
        working: [`${fmt(current.totalA)} A > ${fmt(feed.relay.contactRatingA)} A`],
        sourceIds: ['common-practice'],
      }),
    );
  }

  // Voltage drop along the run.
  if (current.totalA > 0) {
    const limitPct = feed.dropLimitPct ?? DROP_LIMIT_PCT[feed.dropClass];
    const conductorTempC = CONDUCTOR_TEMP_C[feed.wire.zone];
    const drop = voltageDrop({
      currentA: current.totalA,
      runLengthM: feed.wire.lengthM,
      areaMm2: feed.wire.sizeMm2,
      returnPath: feed.wire.returnPath,
      conductorTempC,
      systemV: ctx.systemV,
    });
    if (drop.voltageDropPct > limitPct * (1 + FLOAT_SLACK)) {
      const minSize = minSizeForDrop({
        currentA: current.totalA,
        runLengthM: feed.wire.lengthM,
        returnPath: feed.wire.returnPath,
        conductorTempC,
        systemV: ctx.systemV,
        dropLimitPct: limitPct,
        series: ctx.options.sizeUnit,
      });
      findings.push(
        finding({
          rule: 'voltage_drop',
          severity: feed.dropClass === 'critical' ? 'error' : 'warning',
          subject,
          title: 'Voltage drop too high',
          message:
            `"${feed.name}" loses ${fmt(drop.voltageDropV)} V (${fmt(drop.voltageDropPct, 1)} % of ${ctx.systemV} V) over ${fmt(feed.wire.lengthM)} m of ${ctx.size(feed.wire.sizeMm2)} at ${fmt(current.totalA)} A; the limit for a ${feed.dropClass} circuit is ${fmt(limitPct)} %.` +
            (minSize
              ? ` Use at least ${ctx.size(minSize.areaMm2)}.`
              : ' No listed size keeps it within the limit: shorten the run.'),
          values: {
            voltageDropV: value('Voltage drop', drop.voltageDropV, 'V', 3),
            voltageDropPct: value('Voltage drop', drop.voltageDropPct, '%'),
            limitPct: value('Limit', limitPct, '%'),
            currentA: value('Current', current.totalA, 'A'),
            conductorLengthM: value('Conductor length', drop.conductorLengthM, 'm'),
            resistanceOhm: value('Conductor resistance', drop.resistanceOhm, 'Ω', 4),
            conductorTempC: value('Conductor temperature', conductorTempC, '°C'),
            suggestedSize: value(
              'Smallest size within the limit',
              minSize ? ctx.size(minSize.areaMm2) : null,
            ),
          },
          working: [
            ...drop.notes,
            `R = 0.017241 Ω·mm²/m × ${fmt(drop.conductorLengthM)} m / ${fmt(feed.wire.sizeMm2, 3)} mm² × (1 + 0.00393 × (${conductorTempC} − 20)) = ${fmt(drop.resistanceOhm, 4)} Ω`,
            `V = ${fmt(current.totalA)} A × ${fmt(drop.resistanceOhm, 4)} Ω = ${fmt(drop.voltageDropV, 3)} V = ${fmt(drop.voltageDropPct, 1)} % of ${ctx.systemV} V`,
            `Conductor taken at ${conductorTempC} °C, the ambient Table 5 assumes ${ZONE_WORDS[feed.wire.zone]}.`,
          ],
          sourceIds: [...drop.sources, 'abyc-e11'],
        }),
      );
    }
  }
  return findings;
}
