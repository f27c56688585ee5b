/** Query and mutation keys of the pin map: every variable a query uses is part of its key. */
export const pinMapKeys = {
  all: ['pin-map'] as const,
  conversion: (conversionId: number) => [...pinMapKeys.all, conversionId] as const,
  connectors: (conversionId: number) =>
    [...pinMapKeys.conversion(conversionId), 'connectors'] as const,
  pins: (conversionId: number) => [...pinMapKeys.conversion(conversionId), 'pins'] as const,
  /** Every pin write of a conversion (single, bulk, batch): the key useIsMutating counts. */
  pinWrites: (conversionId: number) =>
    [...pinMapKeys.conversion(conversionId), 'pin-writes'] as const,
};

/**
 * Pin writes of one conversion run one after another. Each reads the row versions from the cache
 * when its turn comes, so quick successive edits of a row never conflict with each other. One
 * scope per conversion rather than per pin because paste, fill down, undo and selection edits
 * touch many pins at once and a mutation has exactly one scope.
 */
export const pinWriteScope = (conversionId: number) => ({
  id: pinMapKeys.pinWrites(conversionId).join(':'),
});
