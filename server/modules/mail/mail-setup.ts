import type { Env } from '../../config/env.ts';
import { logger } from '../../lib/logger.ts';
import { startOnPortOrAnother } from '../../lib/ports.ts';
import { startFakeSmtp, type FakeSmtp } from './fake-smtp.ts';
import {
  configureMail,
  recoverOutbox,
  startOutboxWorker,
  stopOutboxWorker,
} from './outbox.service.ts';

/**
 * Points the outbox at the configured SMTP server, or in demo mode at a local fake SMTP server
 * started here, and starts sending. Returns a function that stops both.
 */
export async function startMail(env: Env): Promise<() => Promise<void>> {
  let fake: FakeSmtp | null = null;
  if (env.SMTP_HOST) {
    configureMail({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      user: env.SMTP_USER,
      pass: env.SMTP_PASS,
      from: env.MAIL_FROM,
    });
  } else if (env.DEMO) {
    fake = await startOnPortOrAnother('fake SMTP', env.FAKE_SMTP_PORT, (port) =>
      startFakeSmtp({ port }),
    );
    configureMail({ host: fake.host, port: fake.port, secure: false, from: env.MAIL_FROM }, fake);
    logger.info(
      { port: fake.port },
      'demo mode: notices go to the local fake SMTP server (Admin → Mail)',
    );
  } else {
    logger.warn('no SMTP_HOST set: notices stay queued in the outbox until one is configured');
    configureMail(null);
  }
  await recoverOutbox();
  startOutboxWorker(env.OUTBOX_INTERVAL_MS);
  return async () => {
    stopOutboxWorker();
    await fake?.close();
  };
}
