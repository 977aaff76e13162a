import { describe, expect, it } from 'vitest';
import { safeRedirectTo, signInHrefFor } from './redirect-to';

describe('safeRedirectTo', () => {
  it('follows a path on this site, with its query', () => {
    expect(safeRedirectTo(new URLSearchParams({ redirectTo: '/account/addresses?edit=2' }))).toBe('/account/addresses?edit=2');
  });

  it('falls back to the account page when there is nowhere to return to', () => {
    expect(safeRedirectTo(new URLSearchParams())).toBe('/account');
    expect(safeRedirectTo(new URLSearchParams(), '/roastery')).toBe('/roastery');
  });

  it.each(['https://elsewhere.test/', '//elsewhere.test/account', '/\\elsewhere.test', 'javascript:alert(1)', 'account'])(
    'never leaves the site for %s',
    (redirectTo) => {
      expect(safeRedirectTo(new URLSearchParams({ redirectTo }))).toBe('/account');
    },
  );
});

describe('signInHrefFor', () => {
  it('carries the whole location back through sign-in', () => {
    expect(signInHrefFor({ pathname: '/account/profile', search: '?tab=1', hash: '' })).toBe('/sign-in?redirectTo=%2Faccount%2Fprofile%3Ftab%3D1');
  });
});
