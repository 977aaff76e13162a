import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ConfigError, loadConfig, type Config } from '../config';
import { createLogger, type Logger } from './logger';

/** True when the module at `moduleUrl` is the script node was asked to run. */
export function isMainModule(moduleUrl: string): boolean {
  return Boolean(process.argv[1]) && path.resolve(process.argv[1]!) === fileURLToPath(moduleUrl);
}

/**
 * Runs a long-lived process (the server or a worker): refuses a bad config naming the key, starts
 * it, and on SIGINT or SIGTERM stops it once, exiting 0 when the stop finished cleanly.
 */
export async function runMain(name: string, start: (config: Config, logger: Logger) => Promise<{ stop(): Promise<void> }>) {
  let config: Config;
  try {
    config = loadConfig();
  } catch (error) {
    if (!(error instanceof ConfigError)) throw error;
    console.error(error.message);
    process.exit(1);
  }
  const logger = createLogger(config);
  let running: { stop(): Promise<void> };
  try {
    running = await start(config, logger);
  } catch (error) {
    console.error(error instanceof Error ? `${name} could not start: ${error.message}` : error);
    process.exit(1);
  }
  let stopping = false;
  for (const signal of ['SIGINT', 'SIGTERM'] as const) {
    process.once(signal, () => {
      if (stopping) return;
      stopping = true;
      running.stop().then(
        () => process.exit(0),
        (error: unknown) => {
          logger.error({ err: error }, 'shutdown failed');
          process.exit(1);
        },
      );
    });
  }
}
