import type { AppContext } from './context';
import { registerMailWorker } from './features/mail/mail.queue';

/**
 * Every background worker of the server, started once the server is up. Each feature that queues
 * jobs registers its worker here (search sync, e-mail).
 */
export async function registerWorkers(ctx: AppContext): Promise<void> {
  await registerMailWorker(ctx);
}
