/**
 * Rules that follow the wires: through splices and box terminals to ground points and sources.
 * They run when a plan has a harness; a revision frozen before wires existed has none.
 */
import type { Finding } from '../../schemas/checks.schema.ts';
import { fuseProtectsWire } from '../electrical/fuses.ts';
import { HarnessGraph } from '../harness/circuit-graph.ts';
import { finding, value, type CheckContext } from './check-context.ts';
import { ampacityOf } from './feed-rules.ts';

/** Ground points where an extra ground on a sensor return makes a loop (not the ECU's own). */
const CHASSIS_LOCATIONS = new Set(['chassis', 'engine_block', 'body']);

export function harnessGraph(ctx: CheckContext): HarnessGraph | null {
  const harness = ctx.snapshot.harness;
  return harness ? new HarnessGraph(ctx.snapshot, harness, ctx.options.sizeUnit) : null;
}

/** A sensor ground that reaches a chassis or engine ground point by wire (warning, common practice). */
export function sensorGroundsByWire(ctx: CheckContext, graph: HarnessGraph): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (
      pin.signalClass !== 'sensor_ground' ||
      pin.disposition === 'depin' ||
      pin.disposition === 'cut'
    )
      continue;
    const reached = graph.groundsReached(pin.id).filter((r) => {
      const g = graph.harness.groundPoints.find((x) => x.id === r.groundId);
      return g && CHASSIS_LOCATIONS.has(g.location);
    });
    const first = reached[0];
    if (!first) continue;
    const ground = graph.describe(`ground:${first.groundId}`);
    findings.push(
      finding({
        rule: 'sensor_ground_extra_ground',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: 'Extra ground on a sensor ground',
        message: `Sensor ground ${ctx.pinName(pin)} (${pin.function || 'sensor ground'}) reaches ${ground.title} (${ground.lines[0] ?? ''}) by wire. An extra ground on a sensor return can make a ground loop and shift sensor readings: keep sensor returns on the ECU's own sensor ground and take the splice off the chassis wire.`,
        values: {
          ground: value('Reaches', ground.title),
          path: value('By way of', first.path.join(', ')),
        },
        working: [`${ctx.pinName(pin)} → ${first.path.join(' → ')}`],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/** An ECU power-supply pin whose wires reach a source with no fuse on the way (error). */
export function powerPinsByWire(ctx: CheckContext, graph: HarnessGraph): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (
      pin.signalClass !== 'power_feed' ||
      pin.disposition === 'depin' ||
      pin.disposition === 'cut'
    )
      continue;
    if (ctx.connectors.get(pin.connectorId)?.side !== 'ecu') continue;
    const source = graph.unfusedSourceOf(pin.id);
    if (!source) continue;
    findings.push(
      finding({
        rule: 'power_pin_unfused',
        severity: 'error',
        subject: { pinIds: [pin.id] },
        title: 'Power pin wired to a source without a fuse',
        message: `${ctx.pinName(pin)} (${pin.function || 'power feed'}) reaches ${source} by wire with no fuse on the way. A feed without a fuse is a fire risk: run it through a fuse near the source.`,
        values: { source: value('Source', source) },
        working: [],
        sourceIds: ['nec-240-4', 'uscg-183-455'],
      }),
    );
  }
  return findings;
}

/** ECU grounds are never cut or de-pinned (error, common practice). */
export function groundPinsKept(ctx: CheckContext): Finding[] {
  const removed = ctx.snapshot.pins.filter(
    (p) =>
      (p.signalClass === 'power_ground' || p.signalClass === 'sensor_ground') &&
      (p.disposition === 'depin' || p.disposition === 'cut') &&
      ctx.connectors.get(p.connectorId)?.side === 'ecu',
  );
  if (!removed.length) return [];
  return [
    finding({
      rule: 'ground_pin_removed',
      severity: 'error',
      subject: { pinIds: removed.map((p) => p.id) },
      title: `${removed.length} ECU ${removed.length === 1 ? 'ground' : 'grounds'} cut or de-pinned`,
      message: `Every ECU power and sensor ground is needed: ${removed.map((p) => ctx.pinName(p)).join(', ')}. Keep or extend them to their ground points.`,
      values: { count: value('Grounds removed', removed.length) },
      working: [],
      sourceIds: ['common-practice'],
    }),
  ];
}

/** Every wire end fastened before review (warning listing the wires). */
export function unresolvedEnds(_ctx: CheckContext, graph: HarnessGraph): Finding[] {
  const open = graph.harness.wires.filter((w) => w.ends.some((e) => e.kind === 'unresolved'));
  if (!open.length) return [];
  const named = open.map((w) => {
    const end = w.ends.find((e) => e.kind === 'unresolved');
    return end?.kind === 'unresolved' && end.text ? `${w.label} (“${end.text}”)` : w.label;
  });
  const pinIds = open.flatMap((w) => w.ends.flatMap((e) => (e.kind === 'pin' ? [e.refId] : [])));
  return [
    finding({
      rule: 'wire_end_unresolved',
      severity: 'warning',
      subject: { pinIds: [...new Set(pinIds)] },
      title: `${open.length} ${open.length === 1 ? 'wire has' : 'wires have'} an end not yet fastened`,
      message: `Fasten each end to a cavity, splice, ground point or box terminal before review: ${named.slice(0, 10).join(', ')}${named.length > 10 ? ` and ${named.length - 10} more` : ''}.`,
      values: { count: value('Wires', open.length) },
      working: [],
      sourceIds: ['common-practice'],
    }),
  ];
}

/** One cavity, one wire: two wires in a cavity belong in a splice (warning). */
export function cavitiesWithTwoWires(ctx: CheckContext, graph: HarnessGraph): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    const wires = graph.wiresAt(pin.id);
    if (wires.length < 2) continue;
    findings.push(
      finding({
        rule: 'cavity_two_wires',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: 'Two wires in one cavity',
        message: `${ctx.pinName(pin)} holds ${wires.map((w) => w.label.split(' ')[0]).join(' and ')}. A cavity takes one terminal: join the wires in a splice and run one wire to the cavity.`,
        values: { count: value('Wires', wires.length) },
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/** A splice on a feed's path: every wire at it must be one the feed's fuse protects (error). */
export function spliceWiresProtected(ctx: CheckContext, graph: HarnessGraph): Finding[] {
  const findings: Finding[] = [];
  for (const feed of ctx.snapshot.feeds) {
    const fuse = ctx.protectingFuse(feed);
    if (!fuse) continue;
    const circuit = graph.feedCircuit(feed.id);
    if (!circuit) continue;
    for (const node of circuit.nodes.filter((n) => n.kind === 'splice')) {
      const spliceId = Number(node.id.split(':')[1]);
      for (const wire of graph.harness.wires) {
        if (!wire.ends.some((e) => e.kind === 'splice' && e.refId === spliceId)) continue;
        if (wire.sizeMm2 == null) continue;
        const rating = ampacityOf(
          wire.sizeMm2,
          wire.insulationRatingC ?? feed.wire.insulationRatingC,
          feed,
        );
        if (fuseProtectsWire(fuse.fuseA, rating.ampacityA)) continue;
        findings.push(
          finding({
            rule: 'splice_wire_smaller_than_fuse',
            severity: 'error',
            subject: { feedId: feed.id },
            title: 'Wire at a splice smaller than its fuse protects',
            message: `${wire.label} at splice ${node.title} is ${ctx.size(wire.sizeMm2)} (${rating.ampacityA.toFixed(1)} A) on "${feed.name}", whose ${fuse.fuseA} A fuse does not protect it.`,
            values: {
              fuseA: value('Fuse', fuse.fuseA, 'A'),
              ampacityA: value('Wire ampacity, derated', rating.ampacityA, 'A', 1),
            },
            working: rating.notes,
            sourceIds: [...rating.sources, 'nec-240-4'],
          }),
        );
      }
    }
  }
  return findings;
}
