/** Where an import goes: one connector, or the whole conversion (rows name their connector). */
export type ImportTarget =
  | { kind: 'connector'; connectorId: number; label: string }
  | { kind: 'conversion'; conversionId: number };

export function importUrl(target: ImportTarget, dryRun: boolean): string {
  const base =
    target.kind === 'connector'
      ? `/api/connectors/${target.connectorId}/import`
      : `/api/conversions/${target.conversionId}/import`;
  return dryRun ? `${base}?dryRun=1` : base;
}

export function targetName(target: ImportTarget): string {
  return target.kind === 'connector' ? `connector ${target.label}` : 'the whole conversion';
}

export const targetKey = (target: ImportTarget) =>
  target.kind === 'connector'
    ? `connector:${target.connectorId}`
    : `conversion:${target.conversionId}`;
