/**
 * A log that cannot be written (standard output going to a full disk) must not end the process
 * (issue #16). /dev/full answers every write with ENOSPC, as a full disk does.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, openSync, closeSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');

describe('logging to a full disk', () => {
  it.skipIf(!existsSync('/dev/full'))('drops the lines and keeps the process running', () => {
    const full = openSync('/dev/full', 'w');
    try {
      const script = [
        "const { logger } = await import('#server/lib/logger.ts');",
        "for (let i = 0; i < 50; i++) logger.info({ i }, 'a line the disk has no room for');",
        'await new Promise((r) => setTimeout(r, 100));',
        "logger.warn('still here');",
        "process.stderr.write('alive\\n');",
      ].join('\n');
      const run = spawnSync(
        process.execPath,
        ['--import', 'tsx', '--input-type=module', '-e', script],
        {
          cwd: root,
          env: { ...process.env, LOG_LEVEL: 'info', NODE_ENV: 'production' },
          stdio: ['ignore', full, 'pipe'],
          encoding: 'utf8',
          timeout: 60_000,
        },
      );
      expect(run.stderr).toContain('alive');
      expect(run.status).toBe(0);
    } finally {
      closeSync(full);
    }
  });
});
