import type { AppContext } from '../../context';
import { MeiliSearchEngine } from './search.meilisearch';
import { PostgresSearch } from './search.postgres';
import type { SearchEngine } from './search.engine';

/** After Meilisearch fails, searches go straight to PostgreSQL for this long before trying again. */
export const MEILI_BACKOFF_MS = 30_000;

/** The engines of one server, and whether Meilisearch is being skipped after a failure. */
export interface Engines {
  postgres: PostgresSearch;
  meili: MeiliSearchEngine | null;
  downUntil: number;
}

type EngineCtx = Pick<AppContext, 'config' | 'db'>;
const holders = new WeakMap<EngineCtx, Engines>();

export function enginesOf(ctx: EngineCtx): Engines {
  let engines = holders.get(ctx);
  if (!engines) {
    const { MEILI_URL, MEILI_API_KEY, MEILI_INDEX } = ctx.config;
    engines = {
      postgres: new PostgresSearch(ctx.db),
      meili: MEILI_URL
        ? new MeiliSearchEngine({ url: MEILI_URL, apiKey: MEILI_API_KEY, index: MEILI_INDEX })
        : null,
      downUntil: 0,
    };
    holders.set(ctx, engines);
  }
  return engines;
}

export interface Answered<T> {
  value: T;
  engine: SearchEngine['name'];
  /** Meilisearch is configured but PostgreSQL answered. */
  fallback: boolean;
}

/**
 * Asks Meilisearch when it is configured and not backing off; when it fails or times out (its
 * client gives up after about a second), PostgreSQL answers at once and Meilisearch is left alone
 * for MEILI_BACKOFF_MS, so not every request waits for the timeout.
 */
export async function answer<T>(
  ctx: Pick<AppContext, 'config' | 'db' | 'logger'>,
  op: (engine: SearchEngine) => Promise<T>,
): Promise<Answered<T>> {
  const engines = enginesOf(ctx);
  const { meili, postgres } = engines;
  if (meili && Date.now() >= engines.downUntil) {
    try {
      return { value: await op(meili), engine: meili.name, fallback: false };
    } catch (err) {
      engines.downUntil = Date.now() + MEILI_BACKOFF_MS;
      ctx.logger.warn({ err }, 'Meilisearch did not answer; searching PostgreSQL for now');
    }
  }
  return { value: await op(postgres), engine: postgres.name, fallback: meili !== null };
}

/** For the readiness check: which engine answers searches now. */
export async function searchStatus(ctx: EngineCtx): Promise<string> {
  const engines = enginesOf(ctx);
  if (!engines.meili) return 'postgres';
  if (await engines.meili.healthy()) {
    engines.downUntil = 0;
    return 'meilisearch';
  }
  engines.downUntil = Date.now() + MEILI_BACKOFF_MS;
  return 'postgres (meilisearch not answering)';
}
