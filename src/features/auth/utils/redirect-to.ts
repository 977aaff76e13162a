import { paths } from '@/config/paths';

/**
 * The page to return to after signing in, from the `redirectTo` search parameter. Only a path on
 * this site is followed (never `//host` or a full URL), so a crafted link cannot send someone away.
 */
export function safeRedirectTo(search: URLSearchParams, fallback: string = paths.account.overview.getHref()): string {
  const target = search.get('redirectTo');
  if (!target || !target.startsWith('/') || target.startsWith('//') || target.startsWith('/\\')) return fallback;
  return target;
}

/** The sign-in address that brings the person back to `location` afterwards. */
export function signInHrefFor(location: { pathname: string; search: string; hash?: string }): string {
  return paths.signIn.getHref(`${location.pathname}${location.search}${location.hash ?? ''}`);
}
