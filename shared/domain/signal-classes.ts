/** What kind of circuit a pin carries; the checks use it (e.g. no extra ground on a sensor ground). */
export const SIGNAL_CLASSES = [
  'power_feed',
  'power_ground',
  'sensor_ground',
  'sensor_signal',
  'sensor_reference',
  'actuator_output',
  'switched_input',
  'communication',
  'output_signal',
  'shield',
  'none',
] as const;
export type SignalClass = (typeof SIGNAL_CLASSES)[number];

export const SIGNAL_CLASS_LABELS: Record<SignalClass, string> = {
  power_feed: 'Power feed',
  power_ground: 'Power ground',
  sensor_ground: 'Sensor ground',
  sensor_signal: 'Sensor signal',
  sensor_reference: 'Sensor reference',
  actuator_output: 'Actuator output',
  switched_input: 'Switched input',
  communication: 'Communication',
  output_signal: 'Output signal',
  shield: 'Shield / drain',
  none: 'Not set',
};
