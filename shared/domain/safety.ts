/**
 * The usual cautions of the trade, said where the work happens: on the worksheet, on the bench and
 * on the pin map beside the pins they concern. Common practice, no single source; local codes and
 * licensed practice prevail over every one of them.
 */
import { regulatedCategory } from './regulated-circuits.ts';
import type { SignalClass } from './signal-classes.ts';

export const ECU_PROBING_CAUTION =
  'Never probe ECU pins with a test lamp and never put 12 V on an ECU pin: a test lamp draws enough to damage an ECU input or output stage. Use a high-impedance meter, back-probing through the seal only with the proper probe.';

export const INSULATION_TEST_CAUTION =
  'Unplug the ECU and every module before an insulation test: the test voltage destroys electronics.';

export const FUEL_PUMP_CUTOFF_CAUTION =
  'A fuel pump needs a crash or inertia cut-off (or an ECU-controlled pump relay that stops the pump when the engine stops), so a damaged vehicle does not keep pumping fuel.';

export const AIRBAG_CAUTION =
  'Do not cut, splice, extend or probe airbag circuits (usually yellow sleeves or connectors): they stay live after the battery is disconnected and are left to the vehicle maker’s procedure.';

export const REGULATED_CIRCUITS_CAUTION =
  'Emissions and anti-theft circuits may be regulated where the vehicle is used: removing or bypassing them can make the vehicle unlawful to drive. Check the local rules before deciding those pins.';

/** Signal classes whose pins sit directly on an ECU input or output stage. */
const ECU_STAGE_CLASSES: ReadonlySet<SignalClass> = new Set([
  'sensor_signal',
  'sensor_reference',
  'sensor_ground',
  'actuator_output',
  'output_signal',
  'switched_input',
  'communication',
]);

/** The cautions that concern a set of pins, by their signal classes and functions. */
export function cautionsForPins(
  pins: ReadonlyArray<{ signalClass: SignalClass; function: string }>,
): string[] {
  const cautions: string[] = [];
  if (pins.some((p) => ECU_STAGE_CLASSES.has(p.signalClass))) cautions.push(ECU_PROBING_CAUTION);
  if (pins.some((p) => /fuel\s*pump/i.test(p.function))) cautions.push(FUEL_PUMP_CUTOFF_CAUTION);
  if (pins.some((p) => /air\s*bag|srs/i.test(p.function))) cautions.push(AIRBAG_CAUTION);
  if (
    pins.some((p) => {
      const k = regulatedCategory(p.function)?.key;
      return k === 'emissions' || k === 'anti_theft';
    })
  )
    cautions.push(REGULATED_CIRCUITS_CAUTION);
  return cautions;
}
