import { logger } from './logger.ts';

/**
 * Starts a local stand-in server on the port asked for, or on any free port when that one is
 * taken (a second Loomwright on the same machine, a test run beside a dev server).
 */
export async function startOnPortOrAnother<T extends { port: number }>(
  what: string,
  wanted: number,
  start: (port: number) => Promise<T>,
): Promise<T> {
  try {
    return await start(wanted);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw err;
    const started = await start(0);
    logger.warn({ wanted, port: started.port }, `${what} port busy; using another`);
    return started;
  }
}
