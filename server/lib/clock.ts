/**
 * The time scheduling and jobs read. Production uses the system clock; with RESTDAY_TEST_CLOCK on,
 * `POST /api/dev/clock` moves it so tests and demos can advance days.
 */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

export interface AdjustableClock extends Clock {
  /** Moves "now" to the given instant; time keeps running from there. */
  set(instant: Date): void;
}

export function createAdjustableClock(): AdjustableClock {
  let offsetMs = 0;
  return {
    now: () => new Date(Date.now() + offsetMs),
    set(instant) {
      offsetMs = instant.getTime() - Date.now();
    },
  };
}
