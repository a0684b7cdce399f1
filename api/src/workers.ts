import type { Config } from './config';
import type { AppContext } from './context';
import type { QueueSettings } from './lib/jobs';
import { registerMailWorker, mailQueueSettings, MAIL_QUEUE } from './features/mail/mail.queue';
import { REPLIES_QUEUE, sendRepliesMail } from './features/mail/notifications';
import { registerPasswordResetWorker } from './features/auth/password-reset.service';
import { registerSearchWorkers } from './features/search/search.sync';
import { registerFileSweep } from './features/attachments/sweep';

/** Queues whose settings differ from the defaults in lib/jobs.ts. */
export function jobQueueSettings(config: Config): Record<string, QueueSettings> {
  return {
    [MAIL_QUEUE]: mailQueueSettings(config),
    // One waiting job per ticket and contractor gathers a burst of desk replies into one e-mail.
    [REPLIES_QUEUE]: { policy: 'short' },
  };
}

/**
 * Every background worker of the server, started once the server is up. Each feature that queues
 * jobs registers its worker here (search sync, e-mail, the nightly sweep of unused files).
 */
export async function registerWorkers(ctx: AppContext): Promise<void> {
  await registerMailWorker(ctx);
  await ctx.jobs.work<{ ticketId: number; userId: number }>(REPLIES_QUEUE, (job) =>
    sendRepliesMail(ctx, job),
  );
  await registerPasswordResetWorker(ctx);
  await registerFileSweep(ctx);
  // The search index follows the articles only when there is one (Meilisearch).
  if (ctx.config.MEILI_URL) await registerSearchWorkers(ctx);
}
