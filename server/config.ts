import { z } from 'zod';

const devSessionSecret = 'restday-development-only-secret-change-me-0123456789';

const port = (fallback: number) =>
  z
    .string()
    .default(String(fallback))
    .refine((value) => /^\d+$/.test(value) && Number(value) >= 1 && Number(value) <= 65535, {
      message: 'must be a whole number from 1 to 65535',
    })
    .transform(Number);

const flag = z
  .enum(['true', 'false', '1', '0', ''])
  .default('false')
  .transform((value) => value === 'true' || value === '1');

const flagOn = z
  .enum(['true', 'false', '1', '0', ''])
  .default('true')
  .transform((value) => value !== 'false' && value !== '0');

/** Every setting the server reads, with its default. One schema, checked once at start-up. */
export const configSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: port(3000),
    PUBLIC_URL: z.url().optional(),
    DATABASE_URL: z.url({ protocol: /^postgres(ql)?$/ }).default('postgres://restday@127.0.0.1:54329/restday'),
    DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
    DATABASE_CONNECT_TIMEOUT_MS: z.coerce.number().int().min(100).max(60_000).default(2000),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').default(devSessionSecret),
    /** Throttling of sign-in, sign-up, password reset and e-mailed links: one fixed window… */
    AUTH_THROTTLE_WINDOW_MINUTES: z.coerce.number().int().min(1).max(1440).default(15),
    /** …attempts per account from one address (failed sign-ins), and reset e-mails per account… */
    AUTH_THROTTLE_PER_ACCOUNT: z.coerce.number().int().min(1).max(100_000).default(10),
    /** …and attempts per IP address (failed sign-ins, sign-ups, reset requests, link uses). */
    AUTH_THROTTLE_PER_IP: z.coerce.number().int().min(1).max(100_000).default(30),
    SMTP_URL: z.url({ protocol: /^smtps?$/ }).default('smtp://127.0.0.1:1025'),
    MAIL_FROM: z.string().min(3).default('Wrenfield Roastworks <hello@wrenfield.test>'),
    /** The shop's postal address in the e-mail footer (CAN-SPAM asks for one); lines separated by newlines or a literal backslash-n. The default is invented. */
    SHOP_POSTAL_ADDRESS: z.string().trim().min(5).default('12 Old Mill Way\nWrenfield, CO 81640\nUnited States'),
    /** Run the queue workers (outbox relay, jobs) inside the server; off when `npm run worker` processes do it. */
    WORKERS_IN_SERVER: flagOn,
    STRIPE_SECRET_KEY: z.string().min(1).default('sk_test_restday_local'),
    STRIPE_WEBHOOK_SECRET: z.string().startsWith('whsec_').default('whsec_restday_local_development'),
    STRIPE_API_URL: z.url().optional(),
    /** How long a Checkout Session stays payable; Stripe allows 30 minutes to 24 hours. */
    STRIPE_CHECKOUT_EXPIRES_MINUTES: z.coerce.number().int().min(30).max(1440).default(60),
    /**
     * An unpaid order older than this with no payment page recorded (its checkout died between placing
     * the order and saving the page) is cancelled by the unpaid-orders job and its stock put back. A
     * checkout takes a few seconds at most (the payments call gives up after ~4.5 s).
     */
    UNPAID_ORDER_GRACE_MINUTES: z.coerce.number().int().min(1).max(120).default(5),
    UPLOADS_DIR: z.string().min(1).default('.data/uploads'),
    STATIC_DIR: z.string().min(1).default('dist'),
    RESTDAY_TEST_CLOCK: flag,
  })
  .superRefine((config, context) => {
    if (config.NODE_ENV !== 'production') return;
    if (config.RESTDAY_TEST_CLOCK) {
      context.addIssue({ code: 'custom', path: ['RESTDAY_TEST_CLOCK'], message: 'must be off in production' });
    }
    if (config.SESSION_SECRET === devSessionSecret) {
      context.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'must be set to a secret of your own in production' });
    }
    if (!config.PUBLIC_URL) {
      context.addIssue({ code: 'custom', path: ['PUBLIC_URL'], message: 'is required in production' });
    }
  });

export type Config = z.infer<typeof configSchema>;

/** Where customers reach the shop (links in e-mails, Stripe's return pages), without a trailing slash. */
export function publicBaseUrl(config: Pick<Config, 'PUBLIC_URL' | 'HOST' | 'PORT'>): string {
  return (config.PUBLIC_URL ?? `http://${config.HOST}:${config.PORT}`).replace(/\/+$/, '');
}

export class ConfigError extends Error {
  constructor(readonly problems: { key: string; message: string }[]) {
    super(`Restday cannot start: ${problems.map((problem) => `${problem.key} ${problem.message}`).join('; ')}`);
    this.name = 'ConfigError';
  }
}

/** Reads the environment; an empty variable counts as unset. Throws a ConfigError naming each bad key. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const keys = Object.keys(configSchema.shape) as (keyof typeof configSchema.shape)[];
  const given = Object.fromEntries(keys.flatMap((key) => (env[key] ? [[key, env[key]]] : [])));
  const parsed = configSchema.safeParse(given);
  if (parsed.success) return parsed.data;
  throw new ConfigError(
    parsed.error.issues.map((issue) => {
      const key = String(issue.path[0] ?? 'config');
      const value = given[key];
      const shown = value === undefined || /SECRET|KEY|URL/.test(key) ? '' : ` (got "${value}")`;
      return { key, message: `${issue.message}${shown}` };
    }),
  );
}
