import { describe, expect, it } from 'vitest';
import { ApiError } from './api-client';
import { shouldRetry } from './query-client';

describe('shouldRetry', () => {
  it('never retries a 4xx answer: asking again gets the same answer', () => {
    expect(shouldRetry(0, new ApiError(404, 'lot_not_found', 'No lot.'))).toBe(false);
    expect(shouldRetry(0, new ApiError(400, 'invalid_input', 'Bad.'))).toBe(false);
    expect(shouldRetry(0, new ApiError(429, 'throttled', 'Slow down.'))).toBe(false);
  });

  it('retries server and network failures twice, then stops', () => {
    const unavailable = new ApiError(503, 'database_unavailable', 'Down.');
    expect(shouldRetry(0, unavailable)).toBe(true);
    expect(shouldRetry(1, new ApiError(0, 'network_error', 'Offline.'))).toBe(true);
    expect(shouldRetry(2, unavailable)).toBe(false);
  });
});
