import { registerAs } from '@nestjs/config';
import { randomBytes } from 'node:crypto';

export type CribraEnv = 'development' | 'test' | 'production';
export type SignupMode = 'open' | 'invite';

/** Everything the API reads from its environment, typed once (the launcher sets these variables). */
export interface AppConfig {
  env: CribraEnv;
  port: number;
  publicUrl: string;
  databaseUrl: string;
  sessionSecret: string;
  signupMode: SignupMode;
  smtpHost: string;
  smtpPort: number;
  mailFrom: string;
  /** Folder of the built web app, served at `/` with SPA fallback; undefined = API only. */
  webDist?: string;
  /** Sign-in (and reset-request) attempts allowed per IP + e-mail within `signInWindowMs`. */
  signInLimit: number;
  signInWindowMs: number;
}

const DEV_SECRET = 'cribra-development-secret-not-for-production';

function int(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer, got "${value}"`);
  return n;
}

/** Reads and checks the environment; throws with the variable's name on a bad value. */
export function readAppConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const cribraEnv = (env.CRIBRA_ENV ?? 'development') as CribraEnv;
  if (!['development', 'test', 'production'].includes(cribraEnv)) {
    throw new Error(`CRIBRA_ENV must be development, test or production, got "${cribraEnv}"`);
  }
  const signupMode = (env.SIGNUP_MODE ?? 'open') as SignupMode;
  if (signupMode !== 'open' && signupMode !== 'invite') {
    throw new Error(`SIGNUP_MODE must be "open" or "invite", got "${signupMode}"`);
  }
  const port = int(env.PORT, 4310, 'PORT');
  let sessionSecret = env.SESSION_SECRET;
  if (!sessionSecret) {
    if (cribraEnv === 'production') throw new Error('SESSION_SECRET must be set in production');
    // Development without the launcher: a fixed secret keeps sessions across restarts.
    sessionSecret = cribraEnv === 'test' ? randomBytes(32).toString('hex') : DEV_SECRET;
  }
  return {
    env: cribraEnv,
    port,
    publicUrl: (env.PUBLIC_URL ?? `http://127.0.0.1:${port}`).replace(/\/+$/, ''),
    databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:4311/cribra',
    sessionSecret,
    signupMode,
    smtpHost: env.SMTP_HOST ?? '127.0.0.1',
    smtpPort: int(env.SMTP_PORT, 4312, 'SMTP_PORT'),
    mailFrom: env.MAIL_FROM ?? 'Cribra <no-reply@cribra.localhost>',
    webDist: env.WEB_DIST || undefined,
    signInLimit: int(env.SIGNIN_RATE_LIMIT, 5, 'SIGNIN_RATE_LIMIT'),
    signInWindowMs: int(env.SIGNIN_RATE_WINDOW_MS, 60_000, 'SIGNIN_RATE_WINDOW_MS'),
  };
}

/** Nest config namespace: inject with `@Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>`. */
export const appConfig = registerAs('app', () => readAppConfig());
