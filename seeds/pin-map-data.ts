/**
 * The demo pinouts: the fictional KT-20 ECU's three connectors (E1 engine, E2 vehicle, E3
 * transmission and evaporative) and the two vehicle-side connectors fitted to the fictional Corran
 * 100 (V1 bulkhead, DLC diagnostic connector). Every pin assignment is invented; only the DLC
 * follows the open SAE J1962 layout (pins 4, 5, 6, 7, 14, 16).
 */
import type { Disposition } from '#shared/domain/dispositions.ts';
import type { SignalClass } from '#shared/domain/signal-classes.ts';
import type { ConnectorSide } from '#shared/schemas/pin-map.schema.ts';

/** [cavity, function, signal class, colour, size mm², disposition, destination, run m, load A] */
export type DemoPin = [
  cavity: string,
  fn: string,
  signalClass: SignalClass,
  colour: string,
  sizeMm2: number | null,
  disposition: Disposition,
  destination: string,
  runLengthM?: number | null,
  loadCurrentA?: number | null,
];

export interface DemoConnector {
  label: string;
  side: ConnectorSide;
  rows: number;
  columns: number;
  notes: string;
  pins: DemoPin[];
}

const E1: DemoConnector = {
  label: 'E1',
  side: 'ecu',
  rows: 2,
  columns: 20,
  notes: 'ECU connector 1, engine sensors and actuators. Stays with the engine harness.',
  pins: [
    ['1', 'Injector 1 drive', 'actuator_output', 'BU/WH', 0.75, 'keep', ''],
    ['2', 'Injector 2 drive', 'actuator_output', 'BU/RD', 0.75, 'keep', ''],
    ['3', 'Injector 3 drive', 'actuator_output', 'BU/YE', 0.75, 'keep', ''],
    ['4', 'Injector 4 drive', 'actuator_output', 'BU/BK', 0.75, 'keep', ''],
    ['5', 'Ignition coil 1 trigger', 'actuator_output', 'GN/WH', 0.5, 'keep', ''],
    ['6', 'Ignition coil 2 trigger', 'actuator_output', 'GN/RD', 0.5, 'keep', ''],
    ['7', 'Ignition coil 3 trigger', 'actuator_output', 'GN/OG', 0.5, 'keep', ''],
    ['8', 'Ignition coil 4 trigger', 'actuator_output', 'GN/BK', 0.5, 'keep', ''],
    ['9', 'Crank position sensor +', 'sensor_signal', 'WH', 0.5, 'keep', ''],
    ['10', 'Crank position sensor −', 'sensor_ground', 'BK/WH', 0.5, 'keep', ''],
    ['11', 'Crank sensor shield', 'shield', 'BK', 0.5, 'keep', ''],
    ['12', 'Cam position sensor signal', 'sensor_signal', 'YE/BU', 0.5, 'keep', ''],
    ['13', 'Throttle position 1 signal', 'sensor_signal', 'VT/WH', 0.5, 'keep', ''],
    ['14', 'Throttle position 2 signal', 'sensor_signal', 'VT/YE', 0.5, 'keep', ''],
    ['15', 'Throttle motor +', 'actuator_output', 'RD/BU', 1, 'keep', ''],
    ['16', 'Throttle motor −', 'actuator_output', 'BN/BU', 1, 'keep', ''],
    ['17', 'Sensor reference 5 V, A', 'sensor_reference', 'OG', 0.5, 'keep', ''],
    ['18', 'Sensor reference 5 V, B', 'sensor_reference', 'OG/WH', 0.5, 'keep', ''],
    ['19', 'Sensor ground A', 'sensor_ground', 'BN', 0.5, 'keep', ''],
    ['20', 'Sensor ground B', 'sensor_ground', 'BN/WH', 0.5, 'keep', ''],
    ['21', 'Knock sensor +', 'sensor_signal', 'GY', 0.5, 'keep', ''],
    ['22', 'Knock sensor −', 'sensor_ground', 'GY/BK', 0.5, 'keep', ''],
    ['23', 'Coolant temperature signal', 'sensor_signal', 'YE/GN', 0.5, 'keep', ''],
    ['24', 'Intake air temperature signal', 'sensor_signal', 'YE/RD', 0.5, 'keep', ''],
    ['25', 'Manifold pressure signal', 'sensor_signal', 'PK', 0.5, 'keep', ''],
    ['26', 'Boost control valve', 'actuator_output', 'VT', 0.75, 'keep', ''],
    ['27', 'Upstream oxygen sensor signal', 'sensor_signal', 'GY/WH', 0.5, 'keep', ''],
    ['28', 'Upstream oxygen sensor heater control', 'actuator_output', 'RD/WH', 0.75, 'keep', ''],
    ['29', 'Downstream oxygen sensor signal', 'sensor_signal', 'GY/YE', 0.5, 'keep', ''],
    ['30', 'Downstream oxygen sensor heater control', 'actuator_output', 'RD/YE', 0.75, 'keep', ''],
    ['31', 'Cam timing solenoid', 'actuator_output', 'GN/BU', 0.75, 'keep', ''],
    ['32', 'Oil pressure switch', 'switched_input', 'BN/YE', 0.5, 'keep', ''],
    ['33', 'Alternator field control', 'output_signal', 'WH/RD', 0.5, 'keep', ''],
    ['34', 'Fuel rail pressure signal', 'sensor_signal', 'PK/WH', 0.5, 'keep', ''],
    ['35', 'Power ground 1 (engine block)', 'power_ground', 'BK', 1.5, 'keep', ''],
    ['36', 'Power ground 2 (engine block)', 'power_ground', 'BK', 1.5, 'keep', ''],
    [
      '37',
      'Coil supply from ignition coil feed',
      'power_feed',
      'RD/GN',
      1.5,
      'join',
      'Feed: Ignition coils',
      1.2,
      10,
    ],
    ['38', '', 'none', '', null, 'empty', ''],
    ['39', '', 'none', '', null, 'empty', ''],
    ['40', '', 'none', '', null, 'empty', ''],
  ],
};

const E2: DemoConnector = {
  label: 'E2',
  side: 'ecu',
  rows: 2,
  columns: 14,
  notes: 'ECU connector 2, vehicle side. Everything here is joined to the Corran 100 or removed.',
  pins: [
    [
      '1',
      'Main relay coil control (switches ground)',
      'output_signal',
      'BU/GN',
      0.5,
      'join',
      'Relay R1 terminal 85',
    ],
    [
      '2',
      'ECU main feed 1 (from main relay)',
      'power_feed',
      'RD',
      1.5,
      'join',
      'Feed: ECU main',
      1.5,
      5,
    ],
    [
      '3',
      'ECU main feed 2 (from main relay)',
      'power_feed',
      'RD',
      1.5,
      'join',
      'Feed: ECU main',
      1.5,
      5,
    ],
    ['4', 'Ignition switched input', 'switched_input', 'RD/BK', 0.5, 'join', 'V1-1'],
    [
      '5',
      'Battery constant feed (memory)',
      'power_feed',
      'RD/WH',
      0.75,
      'join',
      'Feed: Diagnostic and memory',
      1.5,
      0.2,
    ],
    ['6', 'Power ground 3', 'power_ground', 'BK', 1.5, 'join', 'Ground stud G1, engine block'],
    ['7', 'Power ground 4', 'power_ground', 'BK', 1.5, 'join', 'Ground stud G1, engine block'],
    ['8', 'Starter request input', 'switched_input', 'YE/BK', 0.5, 'join', 'V1-2'],
    [
      '9',
      'Fuel pump relay coil control',
      'output_signal',
      'GN/VT',
      0.5,
      'join',
      'Relay R2 terminal 85',
    ],
    [
      '10',
      'Cooling fan relay coil control',
      'output_signal',
      'BU/OG',
      0.5,
      'join',
      'Relay R3 terminal 85',
    ],
    ['11', 'Cooling fan high-speed relay control', 'output_signal', 'BU/VT', 0.5, 'cut', ''],
    ['12', 'Engine speed output', 'output_signal', 'GN', 0.5, 'join', 'V1-3'],
    ['13', 'Check-engine lamp', 'output_signal', 'BN/WH', 0.5, 'join', 'V1-4'],
    ['14', 'Vehicle speed input', 'sensor_signal', 'WH/BU', 0.5, 'join', 'V1-6'],
    ['15', 'CAN high', 'communication', 'OG/BK', 0.5, 'join', 'DLC-6'],
    ['16', 'CAN low', 'communication', 'OG/BN', 0.5, 'join', 'DLC-14'],
    ['17', 'K-line', 'communication', 'VT/BK', 0.5, 'join', 'DLC-7'],
    ['18', 'Brake switch input', 'switched_input', 'RD/BU', 0.5, 'join', 'V1-7'],
    ['19', 'Clutch switch input', 'switched_input', 'GY/RD', 0.5, 'join', 'V1-8'],
    ['20', 'Immobiliser data', 'communication', 'WH/VT', 0.5, 'depin', ''],
    ['21', 'Air-conditioning request input', 'switched_input', 'GN/OG', 0.5, 'depin', ''],
    ['22', 'Compressor clutch relay control', 'output_signal', 'GN/BN', 0.5, 'depin', ''],
    ['23', 'Cruise control switch input', 'switched_input', 'YE/VT', 0.5, 'cut', ''],
    ['24', 'Charge warning lamp', 'output_signal', 'WH/GN', 0.5, 'join', 'V1-5'],
    ['25', 'Fuel level input', 'sensor_signal', 'PK/BK', 0.5, 'cut', ''],
    ['26', 'Sensor ground, vehicle sensors', 'sensor_ground', 'BN/BK', 0.5, 'join', 'DLC-5'],
    ['27', '', 'none', '', null, 'empty', ''],
    ['28', '', 'none', '', null, 'empty', ''],
  ],
};

const E3: DemoConnector = {
  label: 'E3',
  side: 'ecu',
  rows: 2,
  columns: 8,
  notes:
    'ECU connector 3, automatic transmission and evaporative circuits: none of them exist on the truck.',
  pins: [
    ['1', 'Shift solenoid A', 'actuator_output', 'YE', 0.5, 'depin', ''],
    ['2', 'Shift solenoid B', 'actuator_output', 'YE/BK', 0.5, 'depin', ''],
    ['3', 'Converter lock-up solenoid', 'actuator_output', 'YE/BU', 0.5, 'depin', ''],
    ['4', 'Line pressure solenoid', 'actuator_output', 'YE/WH', 0.5, 'depin', ''],
    ['5', 'Transmission fluid temperature', 'sensor_signal', 'GY/GN', 0.5, 'depin', ''],
    ['6', 'Range switch P', 'switched_input', 'GN/GY', 0.5, 'depin', ''],
    ['7', 'Range switch R', 'switched_input', 'GN/PK', 0.5, 'depin', ''],
    ['8', 'Range switch N', 'switched_input', 'GN/TQ', 0.5, 'depin', ''],
    ['9', 'Range switch D', 'switched_input', 'GN/SR', 0.5, 'depin', ''],
    ['10', 'Input shaft speed sensor', 'sensor_signal', 'WH/BK', 0.5, 'cut', ''],
    ['11', 'Output shaft speed sensor', 'sensor_signal', 'WH/YE', 0.5, 'cut', ''],
    ['12', 'Purge valve', 'actuator_output', 'VT/GN', 0.5, 'cut', ''],
    ['13', 'Canister vent valve', 'actuator_output', 'VT/BN', 0.5, 'cut', ''],
    ['14', 'Fuel tank pressure sensor', 'sensor_signal', 'PK/GN', 0.5, 'cut', ''],
    ['15', 'Transmission solenoid supply', 'power_feed', 'RD/YE', 0.75, 'cut', ''],
    ['16', '', 'none', '', null, 'empty', ''],
  ],
};

const V1: DemoConnector = {
  label: 'V1',
  side: 'vehicle',
  rows: 2,
  columns: 6,
  notes: 'New 12-way bulkhead connector into the Corran 100 cab harness.',
  pins: [
    [
      '1',
      'Ignition switch, run position (terminal 15)',
      'switched_input',
      'RD/BK',
      0.5,
      'join',
      'Ignition switch terminal 15',
    ],
    [
      '2',
      'Starter solenoid signal (terminal 50)',
      'switched_input',
      'YE/BK',
      0.5,
      'join',
      'Ignition switch terminal 50',
    ],
    ['3', 'Tachometer signal', 'output_signal', 'GN', 0.5, 'join', 'Tachometer input'],
    ['4', 'Check-engine lamp', 'output_signal', 'BN/WH', 0.5, 'join', 'New dash lamp, 12 V LED'],
    ['5', 'Charge warning lamp', 'output_signal', 'WH/GN', 0.5, 'join', 'Existing charge lamp'],
    ['6', 'Speed sender', 'sensor_signal', 'WH/BU', 0.5, 'join', 'Gearbox speed sender'],
    [
      '7',
      'Brake switch',
      'switched_input',
      'RD/BU',
      0.5,
      'join',
      'Brake lamp switch, switched side',
    ],
    ['8', 'Clutch switch', 'switched_input', 'GY/RD', 0.5, 'join', 'New clutch pedal switch'],
    ['9', '', 'none', '', null, 'empty', ''],
    ['10', '', 'none', '', null, 'empty', ''],
    ['11', '', 'none', '', null, 'empty', ''],
    ['12', '', 'none', '', null, 'empty', ''],
  ],
};

/** SAE J1962 16-pin diagnostic connector: 4 chassis ground, 5 signal ground, 6 CAN high, 7 K-line, 14 CAN low, 16 battery +. */
const DLC: DemoConnector = {
  label: 'DLC',
  side: 'vehicle',
  rows: 2,
  columns: 8,
  notes: 'New 16-pin diagnostic connector under the dash (SAE J1962 layout).',
  pins: [
    ['1', '', 'none', '', null, 'empty', ''],
    ['2', '', 'none', '', null, 'empty', ''],
    ['3', '', 'none', '', null, 'empty', ''],
    ['4', 'Chassis ground', 'power_ground', 'BK', 1, 'join', 'Ground stud G2, cab'],
    ['5', 'Signal ground', 'sensor_ground', 'BN/BK', 0.5, 'join', 'E2-26'],
    ['6', 'CAN high', 'communication', 'OG/BK', 0.5, 'join', 'E2-15'],
    ['7', 'K-line', 'communication', 'VT/BK', 0.5, 'join', 'E2-17'],
    ['8', '', 'none', '', null, 'empty', ''],
    ['9', '', 'none', '', null, 'empty', ''],
    ['10', '', 'none', '', null, 'empty', ''],
    ['11', '', 'none', '', null, 'empty', ''],
    ['12', '', 'none', '', null, 'empty', ''],
    ['13', '', 'none', '', null, 'empty', ''],
    ['14', 'CAN low', 'communication', 'OG/BN', 0.5, 'join', 'E2-16'],
    ['15', '', 'none', '', null, 'empty', ''],
    [
      '16',
      'Battery + (unswitched)',
      'power_feed',
      'RD/WH',
      1,
      'join',
      'Feed: Diagnostic and memory',
      2.5,
      8,
    ],
  ],
};

export const SIGNED_OFF_CONNECTORS: DemoConnector[] = [E1, E2, E3, V1, DLC];

/** Pins of one connector with some cavities replaced. */
const withPins = (connector: DemoConnector, replaced: DemoPin[]): DemoConnector => ({
  ...connector,
  pins: connector.pins.map((p) => replaced.find((r) => r[0] === p[0]) ?? p),
});

/**
 * The draft differs from the signed-off plan by the problems the checks must find (two pins still
 * undecided, an extra chassis ground joined to a sensor ground) and by the electronic throttle's
 * accelerator pedal, wired through the bulkhead: two signal tracks, a 5 V reference and a ground.
 */
export const DRAFT_CONNECTORS: DemoConnector[] = [
  withPins(E1, [
    [
      '19',
      'Sensor ground A',
      'sensor_ground',
      'BN',
      0.5,
      'join',
      'Chassis ground stud, left inner wing',
    ],
    ['38', 'Pedal sensor reference 5 V', 'sensor_reference', 'OG/GN', 0.5, 'join', 'V1-11'],
    ['39', 'Pedal sensor ground', 'sensor_ground', 'BN/GN', 0.5, 'join', 'V1-12'],
  ]),
  withPins(E2, [
    ['27', 'Pedal position 1 signal', 'sensor_signal', 'GN/WH', 0.5, 'join', 'V1-9'],
    ['28', 'Pedal position 2 signal', 'sensor_signal', 'GN/YE', 0.5, 'join', 'V1-10'],
  ]),
  {
    ...E3,
    pins: E3.pins.map((p) =>
      p[0] === '13' || p[0] === '14'
        ? ([p[0], p[1], p[2], p[3], p[4], 'undecided', ''] as DemoPin)
        : p,
    ),
  },
  withPins(V1, [
    ['9', 'Pedal track 1', 'sensor_signal', 'GN/WH', 0.5, 'join', 'Accelerator pedal, track 1'],
    ['10', 'Pedal track 2', 'sensor_signal', 'GN/YE', 0.5, 'join', 'Accelerator pedal, track 2'],
    [
      '11',
      'Pedal sensor reference 5 V',
      'sensor_reference',
      'OG/GN',
      0.5,
      'join',
      'Accelerator pedal, 5 V',
    ],
    [
      '12',
      'Pedal sensor ground',
      'sensor_ground',
      'BN/GN',
      0.5,
      'join',
      'Accelerator pedal, ground',
    ],
  ]),
  DLC,
];
