/**
 * Roots of query keys that one feature's writes make stale in another's cache, kept here so the
 * features need not import each other: a pin's destination moves its wire (the harness lists), and
 * a pin joined to a feed is one of its loads (the feed list).
 */
export const HARNESS_KEY_ROOT = 'harness';
export const FEEDS_KEY_ROOT = 'feeds';
