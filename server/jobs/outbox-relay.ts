import type { Logger } from '../lib/logger';
import type { OutboxRelay } from '../modules/outbox/outbox.service';

export interface RelayRunner {
  /** Asks for a pass soon (coalesced: many kicks while a pass runs make one more pass). */
  kick(): void;
  /** Resolves when no pass is running or wanted. For tests. */
  idle(): Promise<void>;
  stop(): Promise<void>;
}

/**
 * Runs the outbox relay in this process: a pass whenever `queueEmail`'s NOTIFY arrives (after the
 * writer's commit), and a short poll (every `pollMs`) that picks up what a notification cannot
 * announce: a sendAfter coming due (the rest-day e-mail, read against the Clock), a retry's
 * backoff ending, a crashed relay's lease running out, and anything queued while this process was
 * not listening. One pass at a time per process; several processes share the rows safely.
 */
export function startRelayRunner(relay: OutboxRelay, logger: Logger, options: { pollMs: number }): RelayRunner {
  let running: Promise<void> | undefined;
  let wanted = false;
  let stopped = false;
  let failingSince: number | undefined;
  const idleWaiters: (() => void)[] = [];

  const pass = async () => {
    do {
      wanted = false;
      try {
        await relay.relayOnce();
        if (failingSince !== undefined) logger.info('outbox relay recovered');
        failingSince = undefined;
      } catch (error) {
        // The database is unreachable (or restarting): the next poll tries again.
        if (failingSince === undefined) {
          failingSince = Date.now();
          logger.warn({ err: error }, 'outbox relay pass failed; retrying on the next poll');
        }
      }
    } while (wanted && !stopped);
    running = undefined;
    for (const resolve of idleWaiters.splice(0)) resolve();
  };

  const kick = () => {
    if (stopped) return;
    wanted = true;
    running ??= pass();
  };

  const timer = setInterval(kick, options.pollMs);
  timer.unref();
  kick();

  return {
    kick,
    async idle() {
      if (!running) return;
      await new Promise<void>((resolve) => idleWaiters.push(resolve));
    },
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
