/**
 * `npm start`: builds the client when dist/ is missing or older than its sources, then runs the
 * server, which serves the API and the built client on PORT (default 3000).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const builtIndex = path.join(root, 'dist', 'index.html');

function newestChange(entry: string): number {
  const full = path.join(root, entry);
  if (!existsSync(full)) return 0;
  const stat = statSync(full);
  if (!stat.isDirectory()) return stat.mtimeMs;
  return readdirSync(full).reduce(
    (newest, child) => Math.max(newest, newestChange(path.join(entry, child))),
    stat.mtimeMs,
  );
}

const sources = ['src', 'shared', 'fonts', 'index.html', 'vite.config.ts', 'package.json'];
const builtAt = existsSync(builtIndex) ? statSync(builtIndex).mtimeMs : 0;
if (builtAt < Math.max(...sources.map(newestChange))) {
  process.stdout.write('Building the Loomwright client…\n');
  execFileSync(
    process.execPath,
    [path.join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--logLevel', 'warn'],
    {
      cwd: root,
      stdio: 'inherit',
    },
  );
}

process.env.NODE_ENV ??= 'production';
await import('../server/index.ts');
