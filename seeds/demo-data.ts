/**
 * The invented demo scenario (../shared/demo-scenario.md in the team documents): a three-person
 * swap shop fitting the fictional "KT-20" 2.0 L turbo four into fictional "Corran 100" flatbed
 * trucks. Every name, engine and pin here is made up.
 */
import type { Role } from '#shared/auth/roles.ts';

export const DEMO_WORKSHOP = {
  name: 'Harrow Lane Engine Works',
  paperSize: 'A4' as const,
  sizeUnit: 'mm2' as const,
  systemVoltage: 12,
  defaultInsulationC: 105,
  serviceAllowancePct: 15,
};

export const DEMO_USERS: Array<{ email: string; name: string; role: Role }> = [
  { email: 'admin@example.com', name: 'Maren Holt', role: 'admin' },
  { email: 'builder@example.com', name: 'Ivo Brandt', role: 'builder' },
  { email: 'tech@example.com', name: 'Sal Okafor', role: 'technician' },
  { email: 'reviewer@example.com', name: 'Dana Whitlow', role: 'reviewer' },
];

export const DEMO_CONVERSIONS = {
  signedOff: {
    name: 'Pellow farm flatbed',
    donorEngine: 'KT-20 2.0 L turbo I4 (from a mid-size hatchback)',
    receivingVehicle: 'Corran 100 one-tonne flatbed, 1974',
    systemVoltage: 12 as const,
    notes:
      'Carburetted engine removed. New 8-way fuse and relay block behind the passenger kick panel; ' +
      'diagnostic connector under the dash. Automatic-transmission and evaporative circuits removed.',
  },
  draft: {
    name: 'Ashby yard truck',
    donorEngine: 'KT-20 2.0 L turbo I4 (from a mid-size hatchback)',
    receivingVehicle: 'Corran 100 one-tonne flatbed, 1977',
    systemVoltage: 12 as const,
    notes:
      'Rear-mounted fuel pump under the bed. Electric cooling fan from the donor. Still being mapped.',
  },
};
