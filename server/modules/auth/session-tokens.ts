import { createHash, hkdfSync, randomBytes } from 'node:crypto';
import type { CookieOptions, Response } from 'express';
import { jwtVerify, SignJWT } from 'jose';
import type { Config } from '../../config';

const algorithm = 'HS256';
const audience = 'restday-web';
/** Longer values are not ours: refuse them before any parsing. */
const MAX_TOKEN_LENGTH = 2048;

/** 256 random bits, URL-safe: session ids, reset and invitation tokens. */
export const randomToken = () => randomBytes(32).toString('base64url');

/** What the database keeps of a secret token: its SHA-256, so a leaked table grants nothing. */
export const tokenDigest = (token: string) => createHash('sha256').update(token).digest('hex');

export interface SessionTokenClaims {
  userId: string;
  /** The JWT id; its digest is the sessions row's id. */
  sessionKey: string;
}

/**
 * The session cookie's value: a JWT signed with a key derived from SESSION_SECRET. Verification
 * accepts only HS256 (never `none`, never a key the token names), and checks exp, aud and iss;
 * the sessions table decides whether the session is still live.
 */
export function createSessionTokens(config: Pick<Config, 'SESSION_SECRET' | 'PUBLIC_URL'>) {
  const key = new Uint8Array(hkdfSync('sha256', config.SESSION_SECRET, 'restday', 'session token v1', 32));
  const issuer = config.PUBLIC_URL ? new URL(config.PUBLIC_URL).origin : 'restday';

  return {
    sign(claims: SessionTokenClaims, issuedAt: Date, expiresAt: Date): Promise<string> {
      return new SignJWT({})
        .setProtectedHeader({ alg: algorithm, typ: 'JWT' })
        .setSubject(claims.userId)
        .setJti(claims.sessionKey)
        .setIssuer(issuer)
        .setAudience(audience)
        .setIssuedAt(issuedAt)
        .setExpirationTime(expiresAt)
        .sign(key);
    },

    /** The claims of a genuine, unexpired token; undefined for anything else. */
    async verify(token: string, now: Date): Promise<SessionTokenClaims | undefined> {
      if (token.length > MAX_TOKEN_LENGTH) return undefined;
      try {
        const { payload } = await jwtVerify(token, key, {
          algorithms: [algorithm],
          audience,
          issuer,
          currentDate: now,
          requiredClaims: ['sub', 'jti', 'exp', 'iat'],
        });
        return payload.sub && payload.jti ? { userId: payload.sub, sessionKey: payload.jti } : undefined;
      } catch {
        return undefined;
      }
    },
  };
}

export type SessionTokens = ReturnType<typeof createSessionTokens>;

/**
 * `__Host-` in production: the browser then insists on Secure, Path=/ and no Domain, so no
 * sibling subdomain can plant or overwrite the cookie.
 */
export function sessionCookieName(config: Pick<Config, 'NODE_ENV'>): string {
  return config.NODE_ENV === 'production' ? '__Host-restday_session' : 'restday_session';
}

function sessionCookieOptions(config: Pick<Config, 'NODE_ENV'>, maxAgeMs?: number): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'lax',
    secure: config.NODE_ENV === 'production',
    path: '/',
    ...(maxAgeMs === undefined ? {} : { maxAge: maxAgeMs }),
  };
}

/** One cookie's value from a Cookie header (RFC 6265 pairs), or undefined. */
export function readCookie(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const pair of header.split(';')) {
    const separator = pair.indexOf('=');
    if (separator > 0 && pair.slice(0, separator).trim() === name) return pair.slice(separator + 1).trim();
  }
  return undefined;
}

export function writeSessionCookie(res: Response, config: Pick<Config, 'NODE_ENV'>, session: { token: string; maxAgeMs: number }): void {
  res.cookie(sessionCookieName(config), session.token, sessionCookieOptions(config, session.maxAgeMs));
}

export function clearSessionCookie(res: Response, config: Pick<Config, 'NODE_ENV'>): void {
  res.clearCookie(sessionCookieName(config), sessionCookieOptions(config));
}
