import { describe, expect, it } from 'vitest';
import {
  AIRBAG_CAUTION,
  cautionsForPins,
  ECU_PROBING_CAUTION,
  FUEL_PUMP_CUTOFF_CAUTION,
  REGULATED_CIRCUITS_CAUTION,
} from '#shared/domain/safety.ts';

// The usual cautions of the trade (common practice, no source).
describe('cautions by pin', () => {
  it('warns against test lamps and 12 V on ECU stage pins only where there are such pins', () => {
    expect(cautionsForPins([{ signalClass: 'sensor_signal', function: 'Coolant temp' }])).toEqual([
      ECU_PROBING_CAUTION,
    ]);
    expect(cautionsForPins([{ signalClass: 'power_ground', function: 'Ground' }])).toEqual([]);
    expect(ECU_PROBING_CAUTION).toMatch(/test lamp/);
    expect(ECU_PROBING_CAUTION).toMatch(/12 V/);
  });

  it('names the fuel pump cut-off, airbag circuits and regulated circuits by function', () => {
    const cautions = cautionsForPins([
      { signalClass: 'power_feed', function: 'Fuel pump relay' },
      { signalClass: 'none', function: 'Airbag warning lamp' },
      { signalClass: 'none', function: 'Immobiliser data' },
    ]);
    expect(cautions).toEqual([
      FUEL_PUMP_CUTOFF_CAUTION,
      AIRBAG_CAUTION,
      REGULATED_CIRCUITS_CAUTION,
    ]);
    expect(FUEL_PUMP_CUTOFF_CAUTION).toMatch(/crash or inertia cut-off/);
  });
});
