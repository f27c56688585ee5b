/** Rules over the pin map: decisions, joins to fused feeds, sensor grounds, shared destinations. */
import type { Finding } from '../../schemas/checks.schema.ts';
import type { SnapshotPin } from '../../schemas/snapshot.schema.ts';
import { fuseProtectsWire, smallestWireForFuse } from '../electrical/fuses.ts';
import { DRIVER_TYPE_LABELS, outputCarries } from '../electrical/relays.ts';
import { finding, fmt, value, type CheckContext } from './check-context.ts';
import { ampacityOf } from './feed-rules.ts';

/** Every pin must be decided before review: one finding listing them. */
export function checkUndecided(ctx: CheckContext): Finding[] {
  const undecided = ctx.snapshot.pins.filter((p) => p.disposition === 'undecided');
  if (!undecided.length) return [];
  const names = undecided.map((p) => ctx.pinName(p));
  const shown =
    names.length > 12
      ? `${names.slice(0, 12).join(', ')} and ${names.length - 12} more`
      : names.join(', ');
  return [
    finding({
      rule: 'undecided_pins',
      severity: 'error',
      subject: { pinIds: undecided.map((p) => p.id) },
      title: `${undecided.length} ${undecided.length === 1 ? 'pin' : 'pins'} undecided`,
      message: `Decide every pin before review: ${shown}.`,
      values: { count: value('Undecided pins', undecided.length) },
      working: [],
      sourceIds: ['common-practice'],
    }),
  ];
}

/**
 * A pin joined to a new feed is protected by that feed's fuse, so its wire must be one the fuse
 * protects; a power-feed pin joined to the vehicle must have a fuse upstream at all.
 */
export function checkJoinedPins(ctx: CheckContext): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (pin.disposition !== 'join') continue;
    const feed = pin.destinationFeedId != null ? ctx.feeds.get(pin.destinationFeedId) : undefined;
    const fuse = feed ? ctx.protectingFuse(feed) : null;

    if (pin.signalClass === 'power_feed' && !fuse) {
      findings.push(
        finding({
          rule: 'power_pin_unfused',
          severity: 'error',
          subject: { pinIds: [pin.id], ...(feed ? { feedId: feed.id } : {}) },
          title: 'Power pin joined without a fuse upstream',
          message: feed
            ? `${ctx.pinName(pin)} (${pin.function || 'power feed'}) is joined to "${feed.name}", which has no fuse upstream. A feed without a fuse is a fire risk.`
            : `${ctx.pinName(pin)} (${pin.function || 'power feed'}) carries power and is joined to a vehicle circuit that is not one of this conversion's fused feeds. Join it to a fused feed so the fuse can be checked.`,
          values: { destination: value('Destination', feed ? feed.name : pin.destination || null) },
          working: [],
          sourceIds: ['nec-240-4', 'uscg-183-455'],
        }),
      );
    }

    if (!feed || !fuse) continue;
    if (pin.sizeMm2 == null) {
      findings.push(
        finding({
          rule: 'joined_wire_size_missing',
          severity: 'warning',
          subject: { pinIds: [pin.id], feedId: feed.id },
          title: 'Wire size not recorded',
          message: `${ctx.pinName(pin)} is joined to "${feed.name}" (${fmt(fuse.fuseA)} A fuse) but its wire size is not recorded, so Loomwright cannot check that the fuse protects it.`,
          values: { fuseA: value('Fuse', fuse.fuseA, 'A') },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
      continue;
    }
    const insulationC = pin.insulationRatingC ?? feed.wire.insulationRatingC;
    const rating = ampacityOf(pin.sizeMm2, insulationC, feed);
    if (fuseProtectsWire(fuse.fuseA, rating.ampacityA)) continue;
    const suggestion = smallestWireForFuse({
      fuseA: fuse.fuseA,
      insulationRatingC: insulationC,
      zone: feed.wire.zone,
      bundled: feed.wire.bundled,
      series: ctx.options.sizeUnit,
      allowExtrapolated: false,
    });
    findings.push(
      finding({
        rule: 'joined_wire_smaller_than_fuse_allows',
        severity: 'error',
        subject: { pinIds: [pin.id], feedId: feed.id },
        title: 'Wire smaller than its fuse protects',
        message:
          `${ctx.pinName(pin)} is wired in ${ctx.size(pin.sizeMm2)} (${fmt(rating.ampacityA, 1)} A) on "${feed.name}", whose ${fmt(fuse.fuseA)} A fuse does not protect it.` +
          (suggestion ? ` Use at least ${ctx.size(suggestion.areaMm2)}.` : ''),
        values: {
          fuseA: value('Fuse', fuse.fuseA, 'A'),
          wireSize: value('Wire size', ctx.size(pin.sizeMm2)),
          ampacityA: value('Wire ampacity, derated', rating.ampacityA, 'A', 1),
          suggestedSize: value(
            'Smallest wire this fuse protects',
            suggestion ? ctx.size(suggestion.areaMm2) : null,
          ),
        },
        working: [
          `${ctx.size(pin.sizeMm2)}, ${insulationC} °C insulation, zone of "${feed.name}": ${fmt(rating.ampacityA, 1)} A`,
          ...rating.notes,
          `${fmt(fuse.fuseA)} A > ${fmt(rating.ampacityA, 1)} A`,
        ],
        sourceIds: [...rating.sources, 'nec-240-4'],
      }),
    );
  }
  return findings;
}

/** Words in a destination that name a chassis or power ground rather than a sensor return. */
const CHASSIS_GROUND =
  /\b(chassis|body|frame|engine block|block|earth|ground stud|gnd stud|battery (negative|-|−)|strap)\b/i;

function joinsChassisGround(ctx: CheckContext, pin: SnapshotPin): string | null {
  if (pin.destinationPinId != null) {
    const target = ctx.pins.get(pin.destinationPinId);
    if (target?.signalClass === 'power_ground')
      return `${ctx.pinName(target)} (${target.function || 'power ground'})`;
    return null;
  }
  return CHASSIS_GROUND.test(pin.destination) ? pin.destination : null;
}

/** An extra ground joined to a sensor ground can make a ground loop (warning, common practice). */
export function checkSensorGrounds(ctx: CheckContext): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (pin.signalClass !== 'sensor_ground' || pin.disposition !== 'join') continue;
    const ground = joinsChassisGround(ctx, pin);
    if (!ground) continue;
    findings.push(
      finding({
        rule: 'sensor_ground_extra_ground',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: 'Extra ground on a sensor ground',
        message: `Sensor ground ${ctx.pinName(pin)} (${pin.function || 'sensor ground'}) is joined to ${ground}. An extra ground on a sensor return can make a ground loop and shift sensor readings: keep sensor returns on the ECU's own sensor ground.`,
        values: { destination: value('Joined to', ground) },
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/** One vehicle-side cavity as the destination of two pins is usually a slip (warning). */
export function checkSharedDestinations(ctx: CheckContext): Finding[] {
  const byTarget = new Map<number, SnapshotPin[]>();
  for (const pin of ctx.snapshot.pins) {
    if (pin.destinationPinId == null || pin.disposition === 'depin' || pin.disposition === 'cut')
      continue;
    const list = byTarget.get(pin.destinationPinId) ?? [];
    list.push(pin);
    byTarget.set(pin.destinationPinId, list);
  }
  const findings: Finding[] = [];
  for (const [targetId, pins] of byTarget) {
    if (pins.length < 2) continue;
    findings.push(
      finding({
        rule: 'destination_used_twice',
        severity: 'warning',
        subject: { pinIds: [...pins.map((p) => p.id), targetId] },
        title: 'Two pins go to one cavity',
        message: `${pins.map((p) => ctx.pinName(p)).join(' and ')} all go to ${ctx.pinName(targetId)}. If that is meant, splice them and say so in the notes; otherwise one destination is wrong.`,
        values: {
          destination: value('Cavity', ctx.pinName(targetId)),
          count: value('Pins', pins.length),
        },
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/**
 * An ECU output wired straight to a load it cannot carry: the output stage burns out inside the
 * ECU. The fix is a relay whose coil the output drives (common practice, no source).
 */
export function checkEcuOutputs(ctx: CheckContext): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    const ratedA = pin.driverRatedA;
    const loadA = pin.loadCurrentA;
    if (ratedA == null || loadA == null || pin.disposition === 'depin' || pin.disposition === 'cut')
      continue;
    if (outputCarries(ratedA, loadA)) continue;
    findings.push(
      finding({
        rule: 'ecu_output_overload',
        severity: 'error',
        subject: { pinIds: [pin.id] },
        title: 'ECU output wired to a load above its rating',
        message: `${ctx.pinName(pin)} (${pin.function || 'ECU output'}) is ${pin.driverType ? `a ${DRIVER_TYPE_LABELS[pin.driverType].toLowerCase()}` : 'an'} output rated ${fmt(ratedA, 3)} A, wired straight to a load drawing ${fmt(loadA)} A. It would burn out the output stage: drive a relay coil instead, and let the relay switch the load from a fused feed.`,
        values: {
          driverRatedA: value('Output rating', ratedA, 'A', 3),
          loadCurrentA: value('Load on the pin', loadA, 'A'),
        },
        working: [`${fmt(loadA)} A > ${fmt(ratedA, 3)} A`],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}
