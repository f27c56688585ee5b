/**
 * A feed request body for API tests: a horn on a 15 A fuse with a relay, 1.5 mm² over 2 m, chassis
 * return. Override what a test is about.
 */
export const HORN_WIRE = {
  sizeMm2: 1.5,
  insulationRatingC: 105,
  lengthM: 2,
  zone: 'cabin',
  bundled: 1,
  returnPath: 'chassis',
  colour: 'bu/wh',
};

export function feedBody(over: Record<string, unknown> = {}) {
  return {
    name: 'Horn',
    source: 'battery',
    sourceFeedId: null,
    fuseA: 15,
    relay: { contactRatingA: 30, coilCurrentA: 0.15, coilPinId: null },
    wire: HORN_WIRE,
    loads: [{ pinId: null, name: 'Twin horns', currentA: 8, continuous: false }],
    dropClass: 'general',
    dropLimitPct: null,
    notes: '',
    ...over,
  };
}
