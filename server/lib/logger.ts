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
  { write: (line: string) => process.stdout.write(line) },
);
