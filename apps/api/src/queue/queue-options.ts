import { QUEUE_DEFAULT_EXPIRE_SECONDS, QUEUE_RETRY_LIMIT } from '@cribra/contracts';

/** Expiry of an active job before another runner may retry it (tests shorten it). */
export function jobExpireSeconds(env: NodeJS.ProcessEnv = process.env): number {
  const v = Number(env.CRIBRA_JOB_EXPIRE_SECONDS);
  return Number.isInteger(v) && v >= 1 ? v : QUEUE_DEFAULT_EXPIRE_SECONDS;
}

/** Options of every job we send: retried by any runner after its runner died. */
export function jobOptions(env: NodeJS.ProcessEnv = process.env): { retryLimit: number; retryDelay: number; expireInSeconds: number } {
  return { retryLimit: QUEUE_RETRY_LIMIT, retryDelay: 1, expireInSeconds: jobExpireSeconds(env) };
}
