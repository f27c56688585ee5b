/** How people name a cavity: the connector's label and the cavity, "V1-3". */
export const cavityName = (label: string, cavity: string) => `${label}-${cavity}`;

/** Each pin's cavity name by pin id; "?" stands in for a connector the list lacks. */
export function pinNames(plan: {
  connectors: ReadonlyArray<{ id: number; label: string }>;
  pins: ReadonlyArray<{ id: number; connectorId: number; cavity: string }>;
}): Map<number, string> {
  const labels = new Map(plan.connectors.map((c) => [c.id, c.label]));
  return new Map(
    plan.pins.map((p) => [p.id, cavityName(labels.get(p.connectorId) ?? '?', p.cavity)]),
  );
}
