/**
 * Exponential backoff: the first retry (attempt 1) waits `initialMs`, each later one twice the one
 * before, never more than `maxMs`.
 */
export function backoffDelayMs(initialMs: number, maxMs: number, attempt: number): number {
  return Math.min(maxMs, initialMs * 2 ** Math.max(0, attempt - 1));
}
