/**
 * Rules over the small signals: speed and engine-speed pulses, buses, shields, sensor references,
 * relay coils switched by the ECU, lamps, the fuel pump, and the circuits that are regulated or
 * dangerous. Each says what to do; each names its source or says it is common practice.
 */
import type { Finding } from '../../schemas/checks.schema.ts';
import { wireAmpacity } from '../electrical/ampacity.ts';
import type { SnapshotPin } from '../../schemas/snapshot.schema.ts';
import { PULSE_SIGNAL_LABELS } from '../fields/text-parsers.ts';
import type { HarnessGraph } from '../harness/circuit-graph.ts';
import { regulatedCategory } from '../regulated-circuits.ts';
import { finding, fmt, value, type CheckContext } from './check-context.ts';

const SENDS = new Set(['output_signal', 'actuator_output']);
const SQUARE = new Set(['square_5v', 'square_12v']);

/** Pairs of pins joined by one wire (or linked in the pin map when the plan has no wires). */
function pinPairs(
  ctx: CheckContext,
  graph: HarnessGraph | null,
): Array<[SnapshotPin, SnapshotPin]> {
  const pairs: Array<[SnapshotPin, SnapshotPin]> = [];
  if (graph) {
    for (const w of graph.harness.wires) {
      const [a, b] = w.ends;
      if (a.kind !== 'pin' || b.kind !== 'pin') continue;
      const pa = ctx.pins.get(a.refId);
      const pb = ctx.pins.get(b.refId);
      if (pa && pb) pairs.push([pa, pb]);
    }
    return pairs;
  }
  for (const p of ctx.snapshot.pins) {
    const q = p.destinationPinId != null ? ctx.pins.get(p.destinationPinId) : undefined;
    if (q) pairs.push([p, q]);
  }
  return pairs;
}

/** Which of two joined pins sends the signal: an output, else the one not on the ECU. */
function senderFirst(
  ctx: CheckContext,
  a: SnapshotPin,
  b: SnapshotPin,
): [SnapshotPin, SnapshotPin] {
  if (SENDS.has(a.signalClass)) return [a, b];
  if (SENDS.has(b.signalClass)) return [b, a];
  const aOnEcu = ctx.connectors.get(a.connectorId)?.side === 'ecu';
  return aOnEcu ? [b, a] : [a, b];
}

/** Speed and engine-speed signals: a pull-up for open collector, the wave, the pulses. */
export function checkPulseSignals(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const findings: Finding[] = [];
  for (const [a, b] of pinPairs(ctx, graph)) {
    if (a.pulseSignal == null && b.pulseSignal == null) continue;
    const [out, inp] = senderFirst(ctx, a, b);
    const subject = { pinIds: [out.id, inp.id] };
    const names = `${ctx.pinName(out)} → ${ctx.pinName(inp)}`;
    if (out.pulseSignal === 'open_collector' && inp.pulseSignal && SQUARE.has(inp.pulseSignal)) {
      findings.push(
        finding({
          rule: 'pulse_no_pull_up',
          severity: 'warning',
          subject,
          title: 'Open-collector signal to an input with no pull-up',
          message: `${ctx.pinName(out)} (${out.function || 'output'}) only pulls to ground; ${ctx.pinName(inp)} (${inp.function || 'input'}) expects a ${PULSE_SIGNAL_LABELS[inp.pulseSignal]} signal. Fit a pull-up resistor from the signal wire to the input's supply (1–4.7 kΩ is usual), or the gauge reads nothing.`,
          values: {
            sends: value('Sends', PULSE_SIGNAL_LABELS[out.pulseSignal]),
            expects: value('Expects', PULSE_SIGNAL_LABELS[inp.pulseSignal]),
          },
          working: [
            `${names}: open collector into ${PULSE_SIGNAL_LABELS[inp.pulseSignal]}`,
            'Pull-up value: common practice, no source; check the gauge maker’s figure.',
          ],
          sourceIds: ['common-practice'],
        }),
      );
    }
    if (out.pulseSignal === 'ac_sine' && inp.pulseSignal && inp.pulseSignal !== 'ac_sine') {
      findings.push(
        finding({
          rule: 'pulse_wave_mismatch',
          severity: 'warning',
          subject,
          title: 'AC sensor signal to a square-wave input',
          message: `${names}: a magnetic (AC sine) sender into an input that expects ${PULSE_SIGNAL_LABELS[inp.pulseSignal]}. Fit a signal conditioner that turns the sine into a square wave.`,
          values: { sends: value('Sends', 'AC sine') },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
    }
    if (
      out.pulsesPerRev != null &&
      inp.pulsesPerRev != null &&
      out.pulsesPerRev !== inp.pulsesPerRev
    ) {
      const ratio = inp.pulsesPerRev / out.pulsesPerRev;
      findings.push(
        finding({
          rule: 'pulse_ratio',
          severity: 'warning',
          subject,
          title: 'Pulses per revolution do not match',
          message: `${ctx.pinName(out)} sends ${fmt(out.pulsesPerRev)} pulses; ${ctx.pinName(inp)} expects ${fmt(inp.pulsesPerRev)}. The gauge would read ${fmt(out.pulsesPerRev / inp.pulsesPerRev, 3)} × the true value: set the gauge to ${fmt(out.pulsesPerRev)} or fit a pulse converter with a ratio of ${fmt(ratio, 3)}.`,
          values: {
            sends: value('Sends, pulses', out.pulsesPerRev),
            expects: value('Expects, pulses', inp.pulsesPerRev),
            ratio: value('Converter ratio needed', ratio, undefined, 3),
          },
          working: [`${fmt(inp.pulsesPerRev)} / ${fmt(out.pulsesPerRev)} = ${fmt(ratio, 3)}`],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }
  return findings;
}

const CAN_HIGH = /can[\s_-]*(high|hi|h)\b/i;

/**
 * A CAN bus has a 120 Ω termination at each end, two on the bus, so 60 Ω is measured across the
 * pair with the power off (ISO 11898-2). Judged where the plan records terminations at all.
 */
export function checkCanTerminations(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const highs = ctx.snapshot.pins.filter(
    (p) => p.signalClass === 'communication' && CAN_HIGH.test(p.function),
  );
  const bus = new Set<number>();
  const queue = highs.map((p) => p.id);
  // The pins joined to a CAN-high pin are on the same bus.
  const partners = new Map<number, number[]>();
  for (const [a, b] of pinPairs(ctx, graph)) {
    partners.set(a.id, [...(partners.get(a.id) ?? []), b.id]);
    partners.set(b.id, [...(partners.get(b.id) ?? []), a.id]);
  }
  while (queue.length) {
    const id = queue.shift()!;
    if (bus.has(id)) continue;
    bus.add(id);
    for (const next of partners.get(id) ?? []) queue.push(next);
  }
  const nodes = [...bus].map((id) => ctx.pins.get(id)!).filter(Boolean);
  const terminated = nodes.filter((p) => p.terminationOhm != null);
  if (terminated.length === 0 || terminated.length === 2) return [];
  const parallel = 1 / terminated.reduce((sum, p) => sum + 1 / p.terminationOhm!, 0);
  return [
    finding({
      rule: 'can_termination',
      severity: 'warning',
      subject: { pinIds: nodes.map((p) => p.id) },
      title: `CAN bus with ${terminated.length} ${terminated.length === 1 ? 'termination' : 'terminations'}, not two`,
      message:
        terminated.length < 2
          ? `The bus through ${nodes.map((p) => ctx.pinName(p)).join(', ')} has one termination (${terminated.map((p) => ctx.pinName(p)).join(', ')}). A donor module left out probably held the other: fit a 120 Ω terminator across CAN-H and CAN-L at the far end of the bus, so the pair measures about 60 Ω with the power off.`
          : `The bus through ${nodes.map((p) => ctx.pinName(p)).join(', ')} has ${terminated.length} terminations: take out all but the two at its ends.`,
      values: {
        terminations: value('Terminations on the bus', terminated.length),
        measuresOhm: value('Across the pair, power off', parallel, 'Ω', 0),
        expectedOhm: value('Expected', 60, 'Ω', 0),
      },
      working: [
        `${terminated.map((p) => `${fmt(p.terminationOhm!)} Ω at ${ctx.pinName(p)}`).join(' ∥ ')} = ${fmt(parallel, 0)} Ω`,
        'ISO 11898-2: a 120 Ω termination at each end of the bus, 60 Ω across the pair.',
      ],
      sourceIds: ['iso-11898-2'],
    }),
  ];
}

/** A shield is grounded at the ECU end only: a ground point at the far end makes a loop. */
export function checkShields(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (pin.signalClass !== 'shield' || pin.disposition === 'depin' || pin.disposition === 'cut')
      continue;
    const far = graph.groundsReached(pin.id).find((r) => {
      const g = graph.harness.groundPoints.find((x) => x.id === r.groundId);
      return g && g.location !== 'ecu_local';
    });
    if (!far) continue;
    const ground = graph.describe(`ground:${far.groundId}`);
    findings.push(
      finding({
        rule: 'shield_grounded_far_end',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: 'Shield grounded at the far end too',
        message: `${ctx.pinName(pin)} (${pin.function || 'shield'}) is grounded at the ECU and also reaches ${ground.title} by wire. A shield grounded at both ends carries ground current and can put noise on the signal it protects: leave the far end of the drain unconnected and insulated.`,
        values: { ground: value('Also grounded at', ground.title) },
        working: [`${ctx.pinName(pin)} → ${far.path.join(' → ')}`],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/** A sensor reference feeds the ECU's own sensors, never a vehicle circuit. */
export function checkSensorReferences(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const findings: Finding[] = [];
  for (const [a, b] of pinPairs(ctx, graph)) {
    for (const [ref, other] of [
      [a, b],
      [b, a],
    ] as const) {
      if (ref.signalClass !== 'sensor_reference') continue;
      if (ctx.connectors.get(other.connectorId)?.side !== 'vehicle') continue;
      // Carried on to one of the ECU's own sensors (a pedal through the bulkhead): not a load.
      if (other.signalClass === 'sensor_reference') continue;
      findings.push(
        finding({
          rule: 'reference_feeds_vehicle',
          severity: 'error',
          subject: { pinIds: [ref.id, other.id] },
          title: 'Sensor reference wired to a vehicle circuit',
          message: `${ctx.pinName(ref)} (${ref.function || '5 V reference'}) is wired to ${ctx.pinName(other)} on the vehicle side. A sensor reference is a small, regulated supply for the ECU's own sensors: a vehicle gauge or load on it pulls every sensor reading with it. Feed the gauge from its own sender or a fused supply.`,
          values: { to: value('Wired to', ctx.pinName(other)) },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }
  return findings;
}

/**
 * Regulated and dangerous circuits cut or de-pinned: never blocked, always said, with deference to
 * the rules where the vehicle is used.
 */
export function checkRegulatedCircuits(ctx: CheckContext): Finding[] {
  const findings: Finding[] = [];
  for (const pin of ctx.snapshot.pins) {
    if (pin.disposition !== 'cut' && pin.disposition !== 'depin') continue;
    const category = regulatedCategory(pin.function);
    if (!category) continue;
    findings.push(
      finding({
        rule: 'regulated_circuit_removed',
        severity: 'warning',
        subject: { pinIds: [pin.id] },
        title: `${category.label} circuit ${pin.disposition === 'cut' ? 'cut' : 'de-pinned'}`,
        message: `${ctx.pinName(pin)} (${pin.function}) is ${pin.disposition === 'cut' ? 'cut' : 'de-pinned'}. ${category.caution} Removing it may be unlawful where the vehicle is used, may set fault codes, and the ECU calibration may need changing: check the local rules before you build it this way.`,
        values: { category: value('Kind of circuit', category.label) },
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/** The fuel pump: its relay driven by the ECU's pump output, and a crash or inertia cut-off. */
export function checkFuelPump(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const findings: Finding[] = [];
  for (const feed of ctx.snapshot.feeds) {
    const isPump =
      /fuel\s*pump/i.test(feed.name) || feed.loads.some((l) => /fuel\s*pump/i.test(l.name));
    if (!isPump) continue;
    const coilPin = feed.relay?.coilPinId != null ? ctx.pins.get(feed.relay.coilPinId) : undefined;
    if (!coilPin || !/pump/i.test(coilPin.function)) {
      findings.push(
        finding({
          rule: 'fuel_pump_control',
          severity: 'warning',
          subject: { feedId: feed.id },
          title: 'Fuel pump not switched by the ECU’s pump output',
          message: `"${feed.name}" is not driven by the ECU's fuel-pump control output. The ECU primes the pump for a few seconds at key-on and runs it only while the engine turns: drive the pump relay's coil from that output.`,
          values: { coil: value('Coil driven by', coilPin ? ctx.pinName(coilPin) : null) },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
    }
    const circuit = graph?.feedCircuit(feed.id);
    const cutOff = circuit?.nodes.some((n) =>
      /inertia|crash|cut-?off/i.test([n.title, ...n.lines].join(' ')),
    );
    if (!cutOff) {
      findings.push(
        finding({
          rule: 'fuel_pump_cutoff',
          severity: 'warning',
          subject: { feedId: feed.id },
          title: 'No crash or inertia cut-off in the fuel pump circuit',
          message: `"${feed.name}" has no crash or inertia cut-off switch on its way to the pump. Fit one in the pump's feed (or its relay's coil), so a vehicle in a collision stops pumping fuel.`,
          values: {},
          working: ['No node of the pump circuit is named as a crash or inertia cut-off.'],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }
  return findings;
}

/** A relay coil switched to ground by a low-side output needs a supply on its other terminal. */
export function checkCoilSupplies(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const findings: Finding[] = [];
  for (const box of graph.harness.boxes) {
    for (const position of box.positions) {
      if (position.kind !== 'relay') continue;
      const node = `relay:${position.id}`;
      const coilEdges = (graph.adjacency.get(node) ?? []).filter((e) => {
        const t = e.from === node ? e.fromTerminal : e.toTerminal;
        return t === '85' || t === '86';
      });
      const farOf = (e: (typeof coilEdges)[number]) => (e.from === node ? e.to : e.from);
      const driver = coilEdges
        .map((e) => farOf(e))
        .filter((n) => n.startsWith('pin:'))
        .map((n) => ctx.pins.get(Number(n.split(':')[1])))
        .find((p) => p?.driverType === 'low_side');
      if (!driver) continue;
      const supplied = coilEdges.some((e) => {
        const far = farOf(e);
        return far.startsWith('source:') || far.startsWith('fuse:') || far.startsWith('relay:');
      });
      if (supplied) continue;
      findings.push(
        finding({
          rule: 'coil_without_supply',
          severity: 'error',
          subject: { pinIds: [driver.id] },
          title: 'Relay coil switched to ground with no supply',
          message: `${ctx.pinName(driver)} switches the ground side of relay ${position.label}'s coil, but nothing feeds the coil's other terminal. Wire 86 (or 85) to a switched, fused supply, or the relay never pulls in.`,
          values: { relay: value('Relay', `${box.label} ${position.label}`) },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }
  return findings;
}

/**
 * A lamp output driving an LED: some ECUs test their lamp circuit and set a fault when they find
 * no filament; a resistor across the LED is the usual fix (a note, common practice).
 */
export function checkLampOutputs(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  const findings: Finding[] = [];
  for (const [a, b] of pinPairs(ctx, graph)) {
    const [out, far] = senderFirst(ctx, a, b);
    if (!/lamp/i.test(out.function) || ctx.connectors.get(out.connectorId)?.side !== 'ecu')
      continue;
    if (!/\bLED\b/.test(`${far.destination} ${far.notes} ${far.function}`)) continue;
    findings.push(
      finding({
        rule: 'lamp_output_led',
        severity: 'note',
        subject: { pinIds: [out.id, far.id] },
        title: 'Lamp output driving an LED',
        message: `${ctx.pinName(out)} (${out.function}) drives an LED through ${ctx.pinName(far)}. Some ECUs test the lamp circuit and set a fault when they see no filament: if yours does, fit a resistor across the LED so the ECU sees a load.`,
        values: {},
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}

/**
 * ECU power and grounds: the relay feeding the ECU's power pins is switched by the ECU's own
 * relay-control output, every power ground reaches a ground point, the ground point's strap
 * carries what the ECU's feeds draw, and no sensor ground is joined to a power ground.
 */
export function checkEcuPowerAndGrounds(ctx: CheckContext, graph: HarnessGraph | null): Finding[] {
  if (!graph) return [];
  const findings: Finding[] = [];
  const onEcu = (p: SnapshotPin) => ctx.connectors.get(p.connectorId)?.side === 'ecu';
  const ecuPower = ctx.snapshot.pins.filter(
    (p) =>
      onEcu(p) &&
      p.signalClass === 'power_feed' &&
      p.disposition !== 'depin' &&
      p.disposition !== 'cut',
  );

  // The main relay: a relay whose 87 is wired to an ECU power pin.
  for (const box of graph.harness.boxes) {
    for (const position of box.positions) {
      if (position.kind !== 'relay') continue;
      const node = `relay:${position.id}`;
      const edges = graph.adjacency.get(node) ?? [];
      const at = (e: (typeof edges)[number]) => (e.from === node ? e.fromTerminal : e.toTerminal);
      const far = (e: (typeof edges)[number]) => (e.from === node ? e.to : e.from);
      const feedsEcu = edges.some(
        (e) => at(e) === '87' && ecuPower.some((p) => far(e) === `pin:${p.id}`),
      );
      if (!feedsEcu) continue;
      const coil = edges.filter((e) => at(e) === '85' || at(e) === '86');
      const byEcu = coil.some((e) => {
        const n = far(e);
        const pin = n.startsWith('pin:') ? ctx.pins.get(Number(n.split(':')[1])) : undefined;
        return pin != null && onEcu(pin);
      });
      if (byEcu || coil.length === 0) continue;
      findings.push(
        finding({
          rule: 'main_relay_plain_ignition',
          severity: 'warning',
          subject: { pinIds: ecuPower.map((p) => p.id) },
          title: 'ECU main relay switched by plain ignition',
          message: `Relay ${position.label} feeds the ECU's power pins but its coil is not driven by the ECU. Where the donor ECU has a main-relay control output, wire the coil to it: the ECU keeps itself powered after key-off to save its learned values and park its actuators.`,
          values: { relay: value('Relay', `${box.label} ${position.label}`) },
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
    }
  }

  const ecuGrounds = ctx.snapshot.pins.filter(
    (p) => onEcu(p) && p.signalClass === 'power_ground' && graph.isWired(p.id),
  );
  // What the ECU's own feeds carry returns through its power grounds.
  const ecuFeeds = ctx.snapshot.feeds.filter((f) =>
    f.loads.some((l) => l.pinId != null && ecuPower.some((p) => p.id === l.pinId)),
  );
  const returnA = ecuFeeds.reduce((sum, f) => sum + ctx.current(f).totalA, 0);
  const straps = new Map<number, string[]>();
  for (const pin of ecuGrounds) {
    const reached = graph.groundsReached(pin.id);
    if (reached.length === 0) {
      findings.push(
        finding({
          rule: 'power_ground_unreached',
          severity: 'error',
          subject: { pinIds: [pin.id] },
          title: 'ECU power ground reaches no ground point',
          message: `${ctx.pinName(pin)} (${pin.function || 'power ground'}) is wired but its wires end at no ground point. Run it to the engine block or chassis ground it is meant for.`,
          values: {},
          working: [],
          sourceIds: ['common-practice'],
        }),
      );
      continue;
    }
    for (const r of reached)
      straps.set(r.groundId, [...(straps.get(r.groundId) ?? []), ctx.pinName(pin)]);
  }
  for (const [groundId, pins] of straps) {
    const g = graph.harness.groundPoints.find((x) => x.id === groundId);
    if (!g?.strapSizeMm2 || returnA <= 0) continue;
    const rating = wireAmpacity({
      areaMm2: g.strapSizeMm2,
      insulationRatingC: 105,
      zone: g.location === 'engine_block' ? 'engine_bay' : 'cabin',
    });
    if (rating.ampacityA >= returnA) continue;
    findings.push(
      finding({
        rule: 'ground_strap_small',
        severity: 'warning',
        subject: {
          pinIds: ecuGrounds.filter((p) => pins.includes(ctx.pinName(p))).map((p) => p.id),
        },
        title: `Ground strap at ${g.label} smaller than the ECU's return current`,
        message: `${g.label}'s strap (${ctx.size(g.strapSizeMm2)}, ${fmt(rating.ampacityA, 1)} A) takes the ECU's power grounds ${pins.join(', ')}, which return ${fmt(returnA)} A. Fit a heavier strap.`,
        values: {
          strapA: value('Strap ampacity', rating.ampacityA, 'A', 1),
          returnA: value('Return current', returnA, 'A'),
        },
        working: rating.notes,
        sourceIds: rating.sources,
      }),
    );
  }

  // A sensor ground joined straight to a power ground.
  for (const [a, b] of pinPairs(ctx, graph)) {
    const [sensor, power] =
      a.signalClass === 'sensor_ground' ? [a, b] : b.signalClass === 'sensor_ground' ? [b, a] : [];
    if (!sensor || !power || power.signalClass !== 'power_ground') continue;
    findings.push(
      finding({
        rule: 'sensor_ground_to_power_ground',
        severity: 'warning',
        subject: { pinIds: [sensor.id, power.id] },
        title: 'Sensor ground joined to a power ground',
        message: `${ctx.pinName(sensor)} (sensor ground) is wired to ${ctx.pinName(power)} (power ground). Power-ground current shifts every sensor reading that returns on it: keep sensor grounds on the ECU's own sensor-ground pins.`,
        values: {},
        working: [],
        sourceIds: ['common-practice'],
      }),
    );
  }
  return findings;
}
