import { randomUUID } from 'node:crypto';
import { onDatabaseClose } from '../../db/index.ts';

/** How long a preview's work stays ready for the Import button. */
const KEEP_MS = 15 * 60_000;
/** Previews kept at once, the oldest dropped first: a 20,000-line file's plan is some megabytes. */
const MAX_ENTRIES = 4;

interface Entry<T> {
  counter: number;
  at: number;
  value: T;
  /** The preview's id, given to the person who made it, who may apply it without the file. */
  id: string;
  userId: number;
}

/**
 * What a preview worked out (the checked rows and the plan), kept for the apply that usually
 * follows: applying the same file, the same column choices, into the same place, while the
 * conversion's change counter has not moved (migration 0009: triggers move it on every write to the
 * conversion's pins, connectors and feeds) reuses it instead of checking and planning the file again.
 * The caller keys an entry by everything else the work read; the person who made the preview may
 * also name it by its id instead of sending the file again. Emptied when the database closes,
 * since another database reuses ids and counters.
 */
export class PreparedImports<T> {
  private readonly entries = new Map<string, Entry<T>>();

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

  /** Keeps a preview's work; answers the id its maker may apply it by. */
  set(key: string, counter: number, value: T, userId: number): string {
    this.entries.delete(key);
    const id = randomUUID();
    this.entries.set(key, { counter, at: Date.now(), value, id, userId });
    while (this.entries.size > MAX_ENTRIES) this.entries.delete(this.entries.keys().next().value!);
    return id;
  }

  /** The id of the kept preview under `key`, if its maker is `userId`. */
  idOf(key: string, userId: number): string | null {
    const hit = this.entries.get(key);
    return hit && hit.userId === userId ? hit.id : null;
  }

  /** The key of the preview `id`, if `userId` made it and it is still kept. */
  keyOf(id: string, userId: number): string | null {
    for (const [key, entry] of this.entries) {
      if (entry.id === id) return entry.userId === userId ? key : null;
    }
    return null;
  }

  delete(key: string): void {
    this.entries.delete(key);
  }
}
