import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';

const benchDir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

export interface ServerProcess<T> {
  child: ChildProcess;
  url: string;
  info: T;
  /** Resident set size now, in MB (Linux /proc). */
  rssMb: () => number;
  stop: () => Promise<void>;
}

/**
 * Starts bench/servers/<name>.ts in its own Node process (so the load generator never shares
 * the server's event loop) and waits for the JSON line it prints when listening.
 */
export async function startServer<T extends { port: number }>(
  name: 'product' | 'bare',
  env: Record<string, string>,
): Promise<ServerProcess<T>> {
  const child = spawn(
    process.execPath,
    ['--expose-gc', '--import', 'tsx', path.join(benchDir, 'servers', `${name}.ts`)],
    { env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  const lines = createInterface({ input: child.stdout! });
  const info = await new Promise<T>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`bench server ${name} exited (${code})`)));
    lines.once('line', (line) => resolve(JSON.parse(line) as T));
  });
  child.removeAllListeners('exit');
  return {
    child,
    info,
    url: `http://127.0.0.1:${info.port}`,
    rssMb: () => {
      const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
      return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? NaN) / 1024;
    },
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}
