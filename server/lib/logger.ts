import { writeSync } from 'node:fs';
import { pino } from 'pino';

/**
 * JSON-line logs in UTC. Request bodies and headers are never logged; the redact list is a second
 * line of defence for anything that slips into a log object.
 */
export const logger = pino(
  {
    level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'silent' : 'info'),
    base: undefined,
    timestamp: pino.stdTimeFunctions.isoTime,
    redact: {
      paths: [
        'password',
        '*.password',
        'newPassword',
        '*.newPassword',
        'currentPassword',
        '*.currentPassword',
        'token',
        '*.token',
        'authorization',
        '*.authorization',
        'headers.authorization',
        'headers.cookie',
      ],
      censor: '[redacted]',
    },
  },
  // Through process.stdout (not straight to the file descriptor) so tests can read what is logged.
  { write: writeLogLine },
);

/**
 * Set once standard output has failed (a log file on a full disk, a closed pipe). Node would make
 * the failed write an uncaught exception and end the process over a log line; instead the line is
 * dropped, and later lines are written straight to the descriptor, so logging resumes by itself
 * once there is room again.
 */
let stdoutFailed = false;
process.stdout.on('error', () => {
  stdoutFailed = true;
});

function writeLogLine(line: string): void {
  if (!stdoutFailed) {
    process.stdout.write(line);
    return;
  }
  try {
    writeSync(1, line);
  } catch {
    // Still full or gone: this line is lost, the request it describes is not.
  }
}
