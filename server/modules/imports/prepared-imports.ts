import { onDatabaseClose } from '../../db/index.ts';

/** How long a preview's work stays ready for the Import button. */
const KEEP_MS = 15 * 60_000;
/** Previews kept at once, the oldest dropped first: a 20,000-line file's plan is some megabytes. */
const MAX_ENTRIES = 4;

/**
 * What a preview worked out (the checked rows and the plan), kept for the apply that usually
 * follows: applying the same file, the same column choices, into the same place, while the
 * conversion's change counter has not moved (migration 0009: triggers move it on every write to the
 * conversion's pins, connectors and feeds) reuses it instead of checking and planning the file again.
 * The caller keys an entry by everything else the work read. Emptied when the database closes,
 * since another database reuses ids and counters.
 */
export class PreparedImports<T> {
  private readonly entries = new Map<string, { counter: number; at: number; value: T }>();

  constructor() {
    onDatabaseClose(() => this.entries.clear());
  }

  get(key: string, counter: number): T | null {
    const hit = this.entries.get(key);
    if (!hit) return null;
    if (hit.counter !== counter || Date.now() - hit.at > KEEP_MS) {
      this.entries.delete(key);
      return null;
    }
    return hit.value;
  }

  set(key: string, counter: number, value: T): void {
    this.entries.delete(key);
    this.entries.set(key, { counter, at: Date.now(), value });
    while (this.entries.size > MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value!);
  }

  delete(key: string): void {
    this.entries.delete(key);
  }
}
