import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit, type ClientRateLimitInfo, type Options, type Store } from 'express-rate-limit';
import type { Config } from '../../config';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { Logger } from '../../lib/logger';
import type { AuditTrail } from '../audit';
import { tokenDigest } from './session-tokens';
import type { ThrottleRepo } from './throttle.repo';

/** express-rate-limit's Store on PostgreSQL; keys are hashed, so no e-mail or IP is stored. */
class PostgresThrottleStore implements Store {
  readonly localKeys = false;
  private windowMs = 60_000;

  constructor(
    readonly prefix: string,
    private readonly repo: ThrottleRepo,
    private readonly clock: Clock,
    private readonly afterHit: () => void,
  ) {}

  init(options: Options) {
    this.windowMs = options.windowMs;
  }

  private stored(key: string) {
    return tokenDigest(`${this.prefix}${key}`);
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const { hits, resetAt } = await this.repo.hit(this.stored(key), this.windowMs, this.clock.now());
    this.afterHit();
    return { totalHits: hits, resetTime: resetAt };
  }

  async decrement(key: string) {
    await this.repo.unhit(this.stored(key), this.clock.now());
  }

  async resetKey(key: string) {
    await this.repo.clear(this.stored(key));
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.repo.read(this.stored(key), this.clock.now());
    return row && { totalHits: row.hits, resetTime: row.resetAt };
  }
}

const clientIp = (req: Request) => ipKeyGenerator(req.ip ?? 'unknown');
/** The e-mail the request is about, as the schemas normalise it (invalid input still gets a key). */
const bodyEmail = (req: Request) =>
  String((req.body as { email?: unknown } | undefined)?.email ?? '')
    .trim()
    .toLowerCase()
    .slice(0, 254);

type Counted = 'every request' | 'failures only';

const PURGE_EVERY_HITS = 500;

const isOurFailure = (status: number) => status >= 500 || status === 429;
const isClientFailure = (status: number) => status >= 400 && !isOurFailure(status);

export interface AuthThrottleDeps {
  config: Pick<Config, 'AUTH_THROTTLE_WINDOW_MINUTES' | 'AUTH_THROTTLE_PER_ACCOUNT' | 'AUTH_THROTTLE_PER_IP'>;
  repo: ThrottleRepo;
  clock: Clock;
  logger: Logger;
  audit: AuditTrail;
}

/**
 * The throttles in front of the routes a guesser would hammer. Nothing here lets a stranger lock
 * a customer out: sign-in counts failures per account *and address* (a guesser elsewhere fills
 * only their own bucket), plus failures per address; reset e-mails per account are capped, but
 * the links already sent keep working. 429 with Retry-After when a bucket is full.
 */
export function createAuthThrottles({ config, repo, clock, logger, audit }: AuthThrottleDeps) {
  const windowMs = config.AUTH_THROTTLE_WINDOW_MINUTES * 60_000;
  // Ended windows are deleted now and then, by whichever process happens to count the hit.
  let hitsSincePurge = 0;
  const purgeNowAndThen = () => {
    if (++hitsSincePurge < PURGE_EVERY_HITS) return;
    hitsSincePurge = 0;
    repo.purgeEnded(clock.now()).catch((error: unknown) => logger.warn({ err: error }, 'ended throttle windows were not purged'));
  };

  const limiter = (bucket: string, limit: number, key: (req: Request) => string, counted: Counted): RequestHandler =>
    rateLimit({
      windowMs,
      limit,
      keyGenerator: key,
      store: new PostgresThrottleStore(`${bucket}:`, repo, clock, purgeNowAndThen),
      // Failures-only buckets count the client's failures (a wrong password, an unknown account, a
      // bad token); every-request buckets count every answer. Neither counts an outage (5xx, 503)
      // or a 429: they say nothing about the client, so they never fill a bucket.
      ...(counted === 'failures only'
        ? { skipSuccessfulRequests: true, requestWasSuccessful: (_req: Request, res: { statusCode: number }) => !isClientFailure(res.statusCode) }
        : { skipFailedRequests: true, requestWasSuccessful: (_req: Request, res: { statusCode: number }) => !isOurFailure(res.statusCode) }),
      standardHeaders: 'draft-7',
      legacyHeaders: false,
      // The window is read from the server's Clock, so Retry-After is too.
      retryAfter: (req) => {
        const resetTime = (req as Request & { rateLimit?: { resetTime?: Date } }).rateLimit?.resetTime;
        return Math.max(1, Math.ceil(((resetTime?.getTime() ?? clock.now().getTime() + windowMs) - clock.now().getTime()) / 1000));
      },
      handler: async (req, res, next) => {
        await audit.record({ action: 'throttled', actorId: req.user?.id ?? null, ip: req.ip ?? null, detail: { bucket } });
        const minutes = Math.max(1, Math.ceil(Number(res.getHeader('Retry-After') ?? 60) / 60));
        next(new AppError(429, 'too_many_attempts', `Too many attempts. Please wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`));
      },
      logger: {
        error: (error, message) => logger.error({ err: error }, message ?? 'throttle failed'),
        warn: (error, message) => logger.warn({ err: error }, message ?? 'throttle warning'),
      },
    });

  const perIp = (bucket: string, counted: Counted) => limiter(`${bucket}:ip`, config.AUTH_THROTTLE_PER_IP, clientIp, counted);
  const perAccountFromIp = (bucket: string, counted: Counted) =>
    limiter(`${bucket}:account-ip`, config.AUTH_THROTTLE_PER_ACCOUNT, (req) => `${bodyEmail(req)}|${clientIp(req)}`, counted);

  return {
    signIn: [perIp('sign-in', 'failures only'), perAccountFromIp('sign-in', 'failures only')],
    signUp: [perIp('sign-up', 'every request'), perAccountFromIp('sign-up', 'every request')],
    passwordReset: [perIp('reset', 'every request'), limiter('reset:account', config.AUTH_THROTTLE_PER_ACCOUNT, bodyEmail, 'every request')],
    /** Reset confirmations and invitation links: a wrong token is a failure. */
    linkTokens: [perIp('link', 'failures only')],
    /** A current-password check on a signed-in session (e-mail and password change). */
    reauthentication: [limiter('reauth:user', config.AUTH_THROTTLE_PER_ACCOUNT, (req) => req.user?.id ?? clientIp(req), 'failures only')],
  };
}

export type AuthThrottles = ReturnType<typeof createAuthThrottles>;
