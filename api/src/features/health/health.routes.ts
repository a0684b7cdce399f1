import { Router } from 'express';
import { sql } from 'drizzle-orm';
import type { AppContext } from '../../context';
import { searchStatus } from '../search/search.engines';

export function healthRouter(ctx: AppContext): Router {
  const router = Router();

  /** GET /api/health — anyone: the process answers. */
  router.get('/health', (_req, res) => {
    res.set('Cache-Control', 'no-store').json({ status: 'ok', uptimeSeconds: Math.round(process.uptime()) });
  });

  /**
   * GET /api/ready — anyone: the process and its database answer; 503 naming what is down. The
   * search engine is reported but never makes it unready: PostgreSQL answers when Meilisearch is down.
   */
  router.get('/ready', async (_req, res) => {
    res.set('Cache-Control', 'no-store');
    const down = await databaseDown(ctx);
    if (down) {
      res.status(503).json({
        error: {
          code: 'not_ready',
          message: `The database does not answer: ${down}`,
          fields: { database: 'down' },
        },
      });
      return;
    }
    res.json({ status: 'ok', checks: { database: 'up', search: await searchStatus(ctx) } });
  });

  return router;
}

async function databaseDown(ctx: AppContext): Promise<string | null> {
  try {
    await Promise.race([
      ctx.db.execute(sql`select 1`),
      new Promise((_, reject) => setTimeout(() => reject(new Error('no answer within 2 s')), 2000).unref()),
    ]);
    return null;
  } catch (err) {
    return (err as Error).message || 'unreachable';
  }
}
