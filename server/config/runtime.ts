import type { Env } from './env.ts';

let current: Env | null = null;

/** Set once at boot (or by a test) from the validated environment. */
export function setConfig(env: Env): void {
  current = env;
}

export function config(): Env {
  if (!current) throw new Error('Configuration was not loaded');
  return current;
}
