import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { apiErrorResponse, jsonResponse, makeUser, stubFetch } from '@/testing/test-utils';
import { getCurrentUser } from './get-current-user';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('getCurrentUser', () => {
  it('returns the signed-in user from GET /api/auth/me', async () => {
    const user = makeUser({ role: 'staff' });
    stubFetch(() => jsonResponse({ user }));
    expect(await getCurrentUser()).toEqual(user);
  });

  it('reads a visitor from the 200 answer with no user', async () => {
    stubFetch(() => jsonResponse({ user: null }));
    expect(await getCurrentUser()).toBeNull();
  });

  it('passes any other failure on, so the page can offer to try again', async () => {
    stubFetch(() => apiErrorResponse(503, 'database_unavailable', 'Resting for a moment.'));
    await expect(getCurrentUser()).rejects.toBeInstanceOf(ApiError);
  });
});
