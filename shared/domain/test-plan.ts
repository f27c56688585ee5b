/**
 * The test plan generated from a signed-off revision: what to measure before and at first power-up,
 * with the expected value, the pass limit and where each limit comes from. Pure: the same snapshot
 * always gives the same plan, so the tablet, the API and the printed worksheet agree.
 */
import type { ConversionSnapshot, SnapshotPin } from '../schemas/snapshot.schema.ts';
import type { TestPhase, TestPlan, TestStep, TestVerdict } from '../schemas/test-plan.schema.ts';
import { benchPlanItems, BENCH_TEMP_C, CONTINUITY_ALLOWANCE_OHM } from './bench.ts';

/** Key-on voltage at an ECU power pin: within this of the battery (common practice, no source). */
export const POWER_PIN_WITHIN_V = 0.5;
/** Voltage drop across a power ground under load (common practice, no source). */
export const GROUND_DROP_MAX_V = 0.1;
/** A 5 V sensor reference (common practice, no source). */
export const REFERENCE_5V = { min: 4.9, max: 5.1 } as const;
/**
 * CAN-H to CAN-L, power off: two 120 Ω terminations in parallel ≈ 60 Ω (ISO 11898-2). The band
 * 50–65 Ω allows each termination 100–130 Ω (from memory).
 */
export const CAN_PAIR_OHM = { nominal: 60, min: 50, max: 65 } as const;
/** Insulation of a new feed's wire to chassis, ECU and loads unplugged (common practice, no source). */
export const FEED_INSULATION_MIN_MOHM = 1;

const CONTINUITY_SOURCE = `wire resistance: IEC 60028 annealed copper at ${BENCH_TEMP_C} °C; limit: + ${CONTINUITY_ALLOWANCE_OHM} Ω for terminals and contacts (common practice, no source)`;

export const TEST_PHASE_INFO: Record<TestPhase, { title: string; caution: string }> = {
  unplugged: {
    title: 'ECU unplugged, battery disconnected',
    caution:
      'Battery disconnected and every ECU connector unplugged. Meter on resistance; zero the leads first. Never a test lamp on an ECU pin. Insulation tests only with the ECU and every module unplugged.',
  },
  powered: {
    title: 'Key on, ECU plugged in',
    caution:
      'First power-up from a current-limited supply where you can. Fuel pump fuse out until the wiring passes, and the crash or inertia cut-off in circuit. Measure ECU pins with a high-impedance meter only. The CAN measurement is made with the power off.',
  },
  first_start: {
    title: 'First start',
    caution:
      'Fire extinguisher at hand, fuel lines checked for leaks with the pump primed, nobody in front of the fan.',
  },
};

const NO_SOURCE = 'common practice, no source';

/** A step the technician passes or fails by eye or ear: no figure to type. */
function check(
  key: string,
  phase: TestPhase,
  subject: string,
  what: string,
  expectedText = '',
  limitText = '',
): TestStep {
  return {
    key,
    phase,
    subject,
    what,
    unit: 'check',
    expected: null,
    expectedText,
    limit: null,
    limitText,
    source: NO_SOURCE,
  };
}

const isWorked = (p: SnapshotPin) => p.disposition !== 'depin' && p.disposition !== 'cut';

function neighbours(pin: SnapshotPin, snapshot: ConversionSnapshot, name: Map<number, string>) {
  return snapshot.pins
    .filter(
      (q) =>
        q.connectorId === pin.connectorId &&
        Math.abs(q.position - pin.position) === 1 &&
        q.disposition !== 'empty' &&
        isWorked(q),
    )
    .map((q) => name.get(q.id)!);
}

/** The test plan of a revision's snapshot. */
export function buildTestPlan(snapshot: ConversionSnapshot): TestPlan {
  const items = benchPlanItems(snapshot);
  const names = new Map<number, string>();
  for (const i of items) if (i.pin) names.set(i.pin.id, i.name);
  for (const p of snapshot.pins) {
    const label = snapshot.connectors.find((c) => c.id === p.connectorId)?.label ?? '?';
    if (!names.has(p.id)) names.set(p.id, `${label}-${p.cavity}`);
  }
  const ecuConnectors = new Set(
    snapshot.connectors.filter((c) => c.side === 'ecu').map((c) => c.id),
  );
  const steps: TestStep[] = [];

  // Every wire the conversion adds or changes: extended and joined pins, each new feed's wire, and
  // every wire of the harness end to end.
  const wires = items.filter(
    (i) =>
      (i.pin && (i.pin.disposition === 'extend' || i.pin.disposition === 'join')) ||
      i.feed ||
      i.kind === 'wire',
  );
  for (const w of wires) {
    steps.push({
      key: w.key,
      phase: 'unplugged',
      subject: w.name,
      what: `Continuity end to end${w.destinationLabel ? ` to ${w.destinationLabel}` : ''}`,
      unit: 'Ω',
      expected: w.reading!.expectedOhm,
      expectedText:
        w.reading!.expectedOhm != null
          ? `${w.reading!.expectedOhm.toFixed(3)} Ω`
          : 'length not recorded',
      limit: { min: null, max: w.reading!.limitOhm },
      limitText: `≤ ${w.reading!.limitOhm.toFixed(3)} Ω`,
      source: CONTINUITY_SOURCE,
    });
  }
  for (const w of wires) {
    steps.push(
      check(
        `test:short-ground:${w.key}`,
        'unplugged',
        w.name,
        'No short to ground: reads open (OL) to chassis',
        'open',
        'open circuit',
      ),
    );
    const near = w.pin ? neighbours(w.pin, snapshot, names) : [];
    if (near.length) {
      steps.push(
        check(
          `test:short-neighbour:${w.key}`,
          'unplugged',
          w.name,
          `No short to the neighbouring cavities ${near.join(', ')}`,
          'open',
          'open circuit',
        ),
      );
    }
  }
  for (const feed of snapshot.feeds) {
    steps.push({
      key: `test:insulation:feed:${feed.id}`,
      phase: 'unplugged',
      subject: `Feed: ${feed.name}`,
      what: 'Insulation to chassis, fuse out, loads unplugged',
      unit: 'MΩ',
      expected: null,
      expectedText: 'open',
      limit: { min: FEED_INSULATION_MIN_MOHM, max: null },
      limitText: `≥ ${FEED_INSULATION_MIN_MOHM} MΩ`,
      source: NO_SOURCE,
    });
  }

  // Powered: the battery first, as the power pins are judged against it.
  const ecuPins = snapshot.pins.filter((p) => ecuConnectors.has(p.connectorId) && isWorked(p));
  const can = ecuPins.filter((p) => p.signalClass === 'communication');
  const canHigh = can.find((p) => /can[\s_-]*(high|hi|h)\b/i.test(p.function));
  const canLow = can.find((p) => /can[\s_-]*(low|lo|l)\b/i.test(p.function));
  if (canHigh && canLow) {
    steps.push({
      key: `test:can:${names.get(canHigh.id)}/${names.get(canLow.id)}`,
      phase: 'powered',
      subject: `${names.get(canHigh.id)} / ${names.get(canLow.id)}`,
      what: 'Resistance across CAN-H and CAN-L, power off',
      unit: 'Ω',
      expected: CAN_PAIR_OHM.nominal,
      expectedText: `≈ ${CAN_PAIR_OHM.nominal} Ω`,
      limit: { min: CAN_PAIR_OHM.min, max: CAN_PAIR_OHM.max },
      limitText: `${CAN_PAIR_OHM.min}–${CAN_PAIR_OHM.max} Ω`,
      source: 'ISO 11898-2: two 120 Ω terminations; band from 100–130 Ω each (from memory)',
    });
  }
  const system = snapshot.conversion.systemVoltage;
  steps.push({
    key: 'test:battery',
    phase: 'powered',
    subject: 'Battery',
    what: 'Battery voltage at the posts, key on',
    unit: 'V',
    expected: null,
    expectedText: `about ${system} V`,
    limit: null,
    limitText: 'recorded; the power pins are judged against it',
    source: NO_SOURCE,
  });
  for (const p of ecuPins.filter((q) => q.signalClass === 'power_feed')) {
    steps.push({
      key: `test:volts:${names.get(p.id)}`,
      phase: 'powered',
      subject: names.get(p.id)!,
      what: `Voltage at the ECU power pin${p.function ? ` (${p.function})` : ''}`,
      unit: 'V',
      expected: null,
      expectedText: 'battery voltage',
      limit: { min: null, max: null, withinOfBatteryV: POWER_PIN_WITHIN_V },
      limitText: `within ${POWER_PIN_WITHIN_V} V of the battery`,
      source: NO_SOURCE,
    });
  }
  for (const p of ecuPins.filter((q) => q.signalClass === 'power_ground')) {
    steps.push({
      key: `test:ground-drop:${names.get(p.id)}`,
      phase: 'powered',
      subject: names.get(p.id)!,
      what: `Voltage drop from the ECU ground pin to the battery negative, under load${p.function ? ` (${p.function})` : ''}`,
      unit: 'V',
      expected: 0,
      expectedText: '0 V',
      limit: { min: null, max: GROUND_DROP_MAX_V },
      limitText: `≤ ${GROUND_DROP_MAX_V} V`,
      source: NO_SOURCE,
    });
  }
  for (const p of ecuPins.filter((q) => q.signalClass === 'sensor_reference')) {
    steps.push({
      key: `test:reference:${names.get(p.id)}`,
      phase: 'powered',
      subject: names.get(p.id)!,
      what: `5 V sensor reference${p.function ? ` (${p.function})` : ''}`,
      unit: 'V',
      expected: 5,
      expectedText: '5.0 V',
      limit: { min: REFERENCE_5V.min, max: REFERENCE_5V.max },
      limitText: `${REFERENCE_5V.min}–${REFERENCE_5V.max} V`,
      source: NO_SOURCE,
    });
  }
  for (const feed of snapshot.feeds.filter((f) => f.relay)) {
    steps.push(
      check(
        `test:relay:feed:${feed.id}`,
        'powered',
        `Feed: ${feed.name}`,
        'The relay clicks when its output is commanded',
        'clicks',
        'clicks, output live',
      ),
    );
  }

  const firstStart: Array<[string, string]> = [
    ['fuel-pressure', 'Fuel pressure within the figure for the fuel system'],
    ['no-fault-lamp', 'No fault lamp once the engine runs'],
    ['tach', 'The tachometer reads engine speed'],
    ['fans', 'The cooling fans switch on at temperature'],
  ];
  for (const [key, what] of firstStart) {
    steps.push(check(`test:start:${key}`, 'first_start', 'Engine', what));
  }
  return { systemVoltage: system, benchTempC: BENCH_TEMP_C, steps };
}

/**
 * Pass or fail at once: a measured step against its limit (a power pin against the battery reading),
 * a check by the technician's own verdict. Unknown while nothing is recorded.
 */
export function judgeStep(
  step: Pick<TestStep, 'unit' | 'limit'>,
  result: { reading: number | null; passed?: boolean; failed?: boolean },
  batteryV: number | null,
): TestVerdict {
  if (step.unit === 'check') {
    if (result.failed) return 'fail';
    if (result.passed) return 'pass';
    return 'unknown';
  }
  if (result.reading == null) return 'unknown';
  const limit = step.limit;
  if (!limit) return 'pass';
  const v = result.reading;
  if (limit.withinOfBatteryV != null) {
    if (batteryV == null) return 'unknown';
    return Math.abs(v - batteryV) <= limit.withinOfBatteryV + 1e-9 ? 'pass' : 'fail';
  }
  if (limit.min != null && v < limit.min - 1e-9) return 'fail';
  if (limit.max != null && v > limit.max + 1e-9) return 'fail';
  return 'pass';
}
