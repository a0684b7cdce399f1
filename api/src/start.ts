import { ConfigError, loadConfig } from './config';
import { handleError } from './lib/errors';
import { createLogger } from './lib/logger';
import { startServer } from './server';

/** Process entry: read the configuration, serve, and stop cleanly on SIGINT/SIGTERM. */
async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(78);
    }
    throw err;
  }
  const logger = createLogger(config);
  process.on('unhandledRejection', (err) => handleError(err, logger));
  process.on('uncaughtException', (err) => {
    handleError(err, logger);
    process.exit(1);
  });
  const server = await startServer(config, { logger });
  logger.info({ url: server.url }, 'Lightoff is serving');
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'stopping');
    server.stop().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err) => {
  console.error('Lightoff could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
