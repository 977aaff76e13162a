import { describe, expect, it } from 'vitest';
import { invitationLinkPath, passwordResetLinkPath } from '@shared/schemas/auth';
import { paths } from './paths';

describe('paths', () => {
  it('route the pages that e-mailed links open, at the addresses the server puts in them', () => {
    expect(paths.resetPassword.path).toBe(passwordResetLinkPath);
    expect(paths.join.path).toBe(invitationLinkPath);
  });

  it('carry the return address through sign-in and account creation', () => {
    expect(paths.signIn.getHref()).toBe('/sign-in');
    expect(paths.signIn.getHref('/account/addresses')).toBe('/sign-in?redirectTo=%2Faccount%2Faddresses');
    expect(paths.createAccount.getHref('/lots?process=honey')).toBe('/create-account?redirectTo=%2Flots%3Fprocess%3Dhoney');
  });
});
