/**
 * Rules over how signal wires are run, read off the harness: a CAN pair twisted and its stubs
 * short, the diagnostic connector's bus pins on the bus they name, crank and cam sensor wires
 * twisted or shielded, the ECU's main power from the main relay, and both tracks of an electronic
 * throttle pedal kept. Each says what to do; each names its source or says it is common practice.
 */
import type { Finding } from '../../schemas/checks.schema.ts';
import type { SnapshotHarness } from '../../schemas/harness.schema.ts';
import type { SnapshotPin } from '../../schemas/snapshot.schema.ts';
import type { HarnessGraph } from '../harness/circuit-graph.ts';
import { finding, fmt, value, type CheckContext } from './check-context.ts';

/** The lines a diagnostic connector or an ECU pin can carry, read from the pin's function. */
export type BusLine = 'can_high' | 'can_low' | 'k_line' | 'l_line' | 'j1850_plus' | 'j1850_minus';

const LINE_NAMES: Record<BusLine, string> = {
  can_high: 'CAN high',
  can_low: 'CAN low',
  k_line: 'K-line',
  l_line: 'L-line',
  j1850_plus: 'SAE J1850 bus +',
  j1850_minus: 'SAE J1850 bus −',
};

/** The line a pin's function names, if any. */
export function busLineOf(pin: Pick<SnapshotPin, 'function'>): BusLine | null {
  const f = pin.function;
  if (/\bcan[\s_-]*(high|hi|h)\b/i.test(f)) return 'can_high';
  if (/\bcan[\s_-]*(low|lo|l)\b/i.test(f)) return 'can_low';
  if (/\bk[\s_-]*line\b/i.test(f)) return 'k_line';
  if (/\bl[\s_-]*line\b/i.test(f)) return 'l_line';
  if (/j1850.*(\+|plus|positive)/i.test(f)) return 'j1850_plus';
  if (/j1850.*(−|-|minus|negative)/i.test(f)) return 'j1850_minus';
  return null;
}

/** SAE J1962: the line each bus cavity of the 16-pin diagnostic connector carries. */
export const J1962_BUS_CAVITIES: Record<string, BusLine> = {
  '2': 'j1850_plus',
  '6': 'can_high',
  '7': 'k_line',
  '10': 'j1850_minus',
  '14': 'can_low',
  '15': 'l_line',
};

/**
 * A stub (a branch off the bus to one node) longer than this is a finding. ISO 11898-2 asks for
 * short stubs; 0.3 m is the figure usually quoted for 1 Mbit/s (from memory).
 */
export const CAN_STUB_MAX_M = 0.3;

type WireOf = SnapshotHarness['wires'][number];

const wireName = (w: WireOf) => w.label;

/** Every CAN wire by its line, read from the CAN pins it reaches through splices. */
function canWires(ctx: CheckContext, graph: HarnessGraph) {
  const lineOfWire = new Map<number, 'can_high' | 'can_low'>();
  const pinsOfLine = new Map<'can_high' | 'can_low', Set<number>>([
    ['can_high', new Set()],
    ['can_low', new Set()],
  ]);
  for (const pin of ctx.snapshot.pins) {
    const line = busLineOf(pin);
    if (line !== 'can_high' && line !== 'can_low') continue;
    if (pin.disposition === 'cut' || pin.disposition === 'depin') continue;
    const reached = graph.line(pin.id);
    for (const id of reached.wireIds) lineOfWire.set(id, line);
    if (reached.wireIds.length) pinsOfLine.get(line)!.add(pin.id);
  }
  return { lineOfWire, pinsOfLine };
}

/**
 * A CAN pair is run twisted, both wires marked with one twist group (ISO 11898-2: twisted pair).
 * A wire of one line with no wire of the other line in its twist group is a finding.
 */
export function checkCanPairs(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const { lineOfWire, pinsOfLine } = canWires(ctx, graph);
  const wires = new Map(graph.harness.wires.map((w) => [w.id, w]));
  const groupsOf = (line: 'can_high' | 'can_low') =>
    new Set(
      [...lineOfWire]
        .filter(([, l]) => l === line)
        .map(([id]) => wires.get(id)?.twistGroup ?? '')
        .filter(Boolean),
    );
  const highGroups = groupsOf('can_high');
  const lowGroups = groupsOf('can_low');
  const loose: WireOf[] = [];
  for (const [id, line] of lineOfWire) {
    const w = wires.get(id);
    if (!w) continue;
    const other = line === 'can_high' ? lowGroups : highGroups;
    if (!w.twistGroup || !other.has(w.twistGroup)) loose.push(w);
  }
  if (loose.length === 0) return [];
  loose.sort((a, b) => a.label.localeCompare(b.label));
  return [
    finding({
      rule: 'can_pair_untwisted',
      severity: 'warning',
      subject: { pinIds: [...pinsOfLine.get('can_high')!, ...pinsOfLine.get('can_low')!] },
      title: 'CAN wires not run as a twisted pair',
      message: `${loose.map((w) => `${wireName(w)} (${LINE_NAMES[lineOfWire.get(w.id)!]})`).join(', ')} ${loose.length === 1 ? 'is' : 'are'} not marked as twisted with a wire of the other CAN line. Twist CAN high and CAN low together along their whole run and give both wires the same twist group, so noise reaches both lines alike and cancels.`,
      values: { wires: value('Wires not paired', loose.length) },
      working: loose.map(
        (w) =>
          `${wireName(w)}: ${LINE_NAMES[lineOfWire.get(w.id)!]}, twist group ${w.twistGroup ? `"${w.twistGroup}" has no wire of the other line` : 'not set'}`,
      ),
      sourceIds: ['iso-11898-2'],
    }),
  ];
}

/**
 * A stub is a branch off the bus, from a splice to a node without the bus's termination; a long
 * stub reflects the signal. ISO 11898-2 asks for short stubs (figure from memory).
 */
export function checkCanStubs(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const { lineOfWire } = canWires(ctx, graph);
  const findings: Finding[] = [];
  for (const w of graph.harness.wires) {
    if (!lineOfWire.has(w.id) || w.lengthM == null || w.lengthM <= CAN_STUB_MAX_M) continue;
    const [a, b] = w.ends;
    const pinEnd = a.kind === 'pin' ? a : b.kind === 'pin' ? b : null;
    const spliceEnd = a.kind === 'splice' ? a : b.kind === 'splice' ? b : null;
    if (!pinEnd || !spliceEnd) continue;
    const node = ctx.pins.get(pinEnd.refId);
    // The wire to a terminated node is the bus itself, not a stub.
    if (!node || node.terminationOhm != null) continue;
    const joined = (graph.adjacency.get(`splice:${spliceEnd.refId}`) ?? []).filter(
      (e) => e.wireId != null,
    ).length;
    if (joined < 3) continue;
    const splice = graph.harness.splices.find((s) => s.id === spliceEnd.refId);
    findings.push(
      finding({
        rule: 'can_stub_long',
        severity: 'warning',
        subject: { pinIds: [node.id] },
        title: `CAN stub ${w.label} longer than ${fmt(CAN_STUB_MAX_M)} m`,
        message: `${w.label} branches ${fmt(w.lengthM)} m from splice ${splice?.label ?? ''} to ${ctx.pinName(node)}. A long stub reflects the signal: move the splice closer to ${ctx.pinName(node)}, or run the bus to it and on, so the branch stays under ${fmt(CAN_STUB_MAX_M)} m.`,
        values: {
          stubM: value('Stub length', w.lengthM, 'm'),
          limitM: value('Longest stub', CAN_STUB_MAX_M, 'm'),
        },
        working: [
          `${w.label}: ${fmt(w.lengthM)} m > ${fmt(CAN_STUB_MAX_M)} m`,
          'ISO 11898-2 asks for short stubs; 0.3 m is the figure quoted for 1 Mbit/s (from memory).',
        ],
        sourceIds: ['iso-11898-2', 'from-memory'],
      }),
    );
  }
  return findings;
}

/** A 16-cavity connector named as the diagnostic connector. */
function isDiagnosticConnector(c: { label: string; notes: string; cavityCount: number }) {
  return c.cavityCount === 16 && /\bDLC\b|diagnostic|J1962/i.test(`${c.label} ${c.notes}`);
}

/**
 * The diagnostic connector's bus pins (SAE J1962) carry the line the standard puts there, and are
 * wired to that line at the ECU: CAN high to CAN high, never crossed.
 */
export function checkDiagnosticConnector(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const findings: Finding[] = [];
  for (const connector of ctx.snapshot.connectors) {
    if (!isDiagnosticConnector(connector)) continue;
    for (const pin of ctx.snapshot.pins) {
      if (pin.connectorId !== connector.id) continue;
      const expected = J1962_BUS_CAVITIES[pin.cavity];
      if (!expected) continue;
      const own = busLineOf(pin);
      const joined = graph
        ? graph.line(pin.id).pinIds
        : pin.destinationPinId != null
          ? [pin.destinationPinId]
          : [];
      const wrong = joined
        .map((id) => ctx.pins.get(id))
        .filter((p): p is SnapshotPin => p != null && p.connectorId !== connector.id)
        .filter((p) => {
          const line = busLineOf(p);
          return line != null && line !== expected;
        });
      if ((own == null || own === expected) && wrong.length === 0) continue;
      const where = `${connector.label}-${pin.cavity}`;
      const problems = [
        own != null && own !== expected ? `it is named ${LINE_NAMES[own]}` : '',
        ...wrong.map((p) => `it is wired to ${ctx.pinName(p)} (${LINE_NAMES[busLineOf(p)!]})`),
      ].filter(Boolean);
      findings.push(
        finding({
          rule: 'diagnostic_pin_wrong_line',
          severity: 'error',
          subject: { pinIds: [pin.id, ...wrong.map((p) => p.id)] },
          title: `Diagnostic connector ${where} is not on ${LINE_NAMES[expected]}`,
          message: `SAE J1962 puts ${LINE_NAMES[expected]} at cavity ${pin.cavity} of the diagnostic connector, but ${problems.join(' and ')}. A scan tool reads nothing through a crossed or misplaced line: wire ${where} to the ECU's ${LINE_NAMES[expected]} pin.`,
          values: {
            expected: value('J1962 cavity carries', LINE_NAMES[expected]),
            found: value('Found', problems.join('; ')),
          },
          working: [`${where}: ${problems.join('; ')}`],
          sourceIds: ['sae-j1962'],
        }),
      );
    }
  }
  return findings;
}

const CRANK_CAM = /\b(crank|cam)(shaft)?\b.*\b(sensor|position|speed)\b|\b(CKP|CMP)\b/i;

/**
 * Crank and cam sensor wires carry small, fast signals beside ignition coils and injectors: they
 * are run twisted with their return, or in a shielded cable (common practice, no source).
 */
export function checkCrankCamWiring(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const wires = new Map(graph.harness.wires.map((w) => [w.id, w]));
  const groupSizes = new Map<string, number>();
  for (const w of graph.harness.wires) {
    if (w.twistGroup) groupSizes.set(w.twistGroup, (groupSizes.get(w.twistGroup) ?? 0) + 1);
  }
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (pin.signalClass !== 'sensor_signal' || !CRANK_CAM.test(pin.function)) continue;
    if (ctx.connectors.get(pin.connectorId)?.side !== 'ecu') continue;
    if (pin.disposition === 'cut' || pin.disposition === 'depin') continue;
    const bare = graph
      .line(pin.id)
      .wireIds.map((id) => wires.get(id))
      .filter((w): w is WireOf => w != null)
      .filter((w) => !w.shielded && !((groupSizes.get(w.twistGroup ?? '') ?? 0) >= 2));
    if (bare.length === 0) continue;
    findings.push(
      finding({
        rule: 'crank_cam_unprotected',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: `${pin.function} run neither twisted nor shielded`,
        message: `${bare.map((w) => w.label).join(', ')} (${ctx.pinName(pin)}, ${pin.function}) ${bare.length === 1 ? 'runs' : 'run'} as plain wire. Ignition and injector wiring beside it can add false teeth to the signal: twist it with the sensor's return wire (same twist group) or run it in a shielded cable grounded at the ECU only.`,
        values: { wires: value('Wires', bare.map((w) => w.label).join(', ')) },
        working: bare.map(
          (w) => `${w.label}: no twist group shared with another wire, not shielded`,
        ),
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

const MAIN_POWER = /\bmain\b/i;
const MEMORY_FEED = /memory|keep[\s-]*alive|backup|constant|permanent|\bKAM\b/i;

/**
 * The ECU's main power pins are fed from the main relay's output (87), through fuses and splices
 * only; the memory feed is the one that comes straight from the battery (common practice).
 */
export function checkEcuMainPower(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (ctx.connectors.get(pin.connectorId)?.side !== 'ecu') continue;
    if (
      pin.signalClass !== 'power_feed' ||
      pin.disposition === 'cut' ||
      pin.disposition === 'depin'
    )
      continue;
    if (!MAIN_POWER.test(pin.function) || MEMORY_FEED.test(pin.function)) continue;
    if (!graph.isWired(pin.id) || graph.relayOutputFeeding(pin.id) != null) continue;
    const direct = graph.unfusedSourceOf(pin.id);
    findings.push(
      finding({
        rule: 'ecu_power_not_from_main_relay',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: `${ctx.pinName(pin)} not fed from the main relay`,
        message: `${ctx.pinName(pin)} (${pin.function}) does not reach a relay's output (87) through its wires${direct ? `; it reaches ${direct} directly` : ''}. The ECU's main power comes from the main relay, so the ECU can hold itself on after key-off and nothing else shares its supply: wire it to the main relay's 87, through its fuse.`,
        values: { reaches: value('Reaches', direct ?? 'no relay output') },
        working: [`From ${ctx.pinName(pin)} through splices and fuses: no relay terminal 87`],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

const PEDAL = /\bpedal\b/i;

/**
 * An electronic throttle's pedal has two tracks the ECU compares; with one track gone the ECU
 * limits the throttle or stops the engine. Every pedal track kept when any is (common practice).
 */
export function checkPedalTracks(ctx: CheckContext): Finding[] {
  const tracks = ctx.snapshot.pins.filter(
    (p) =>
      ctx.connectors.get(p.connectorId)?.side === 'ecu' &&
      p.signalClass === 'sensor_signal' &&
      PEDAL.test(p.function),
  );
  const removed = tracks.filter((p) => p.disposition === 'cut' || p.disposition === 'depin');
  if (removed.length === 0 || removed.length === tracks.length) return [];
  return [
    finding({
      rule: 'pedal_track_removed',
      severity: 'error',
      subject: { pinIds: removed.map((p) => p.id) },
      title: 'A pedal sensor track removed while another is kept',
      message: `${removed.map((p) => `${ctx.pinName(p)} (${p.function})`).join(', ')} ${removed.length === 1 ? 'is' : 'are'} removed, but the ECU reads the pedal on ${tracks.length} tracks and compares them: with one missing it limits the throttle or will not run. Keep every pedal track, each with its own reference and ground.`,
      values: {
        tracks: value('Pedal tracks', tracks.length),
        removed: value('Removed', removed.length),
      },
      working: [],
      sourceIds: ['common-practice'],
    }),
  ];
}
