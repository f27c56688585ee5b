/**
 * Roots of query keys that one feature's writes make stale in another's cache, kept here so the
 * features need not import each other: a pin's destination moves its wire (the harness lists).
 */
export const HARNESS_KEY_ROOT = 'harness';
