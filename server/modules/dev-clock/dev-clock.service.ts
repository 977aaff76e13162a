import type { AdjustableClock, Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { DevClockRepo } from './dev-clock.repo';

/** The channel a clock move is announced on, as the offset from real time in milliseconds. */
export const CLOCK_CHANNEL = 'restday_test_clock';

export function isAdjustableClock(clock: Clock): clock is AdjustableClock {
  return typeof (clock as Partial<AdjustableClock>).set === 'function';
}

/**
 * Called after each move with the instants before and after it: runs what the schedule would have
 * run in between (scheduled jobs are sweeps, so one run catches up however far the clock moved).
 */
export type OnClockMoved = (from: Date, to: Date) => Promise<string[]>;

export function createDevClockService(clock: AdjustableClock, repo: DevClockRepo, logger: Logger, onMoved?: OnClockMoved) {
  return {
    /** Moves "now" here and in every worker process; time keeps running from the new instant. */
    async move(now: Date): Promise<{ now: Date; dueJobs: string[] }> {
      const before = clock.now();
      clock.set(now);
      try {
        await repo.broadcast(CLOCK_CHANNEL, now.getTime() - Date.now());
      } catch (error) {
        // This process's clock has moved; workers elsewhere catch up on the next move.
        logger.warn({ err: error }, 'could not announce the test clock move to other processes');
      }
      const dueJobs = (await onMoved?.(before, now)) ?? [];
      return { now: clock.now(), dueJobs };
    },
  };
}

export type DevClockService = ReturnType<typeof createDevClockService>;

/** A LISTEN handler that applies clock moves announced by any process to this one's clock. */
export function followClockBroadcasts(clock: Clock, onMove: () => void): (payload: string) => void {
  return (payload) => {
    const offsetMs = Number(payload);
    if (!isAdjustableClock(clock) || !Number.isFinite(offsetMs)) return;
    clock.set(new Date(Date.now() + offsetMs));
    onMove();
  };
}
