import { availableParallelism, hostname } from 'node:os';
import { randomBytes } from 'node:crypto';
import { QUEUE_DEFAULT_EXPIRE_SECONDS, RUN_OUTPUT_MAX_BYTES } from '@cribra/contracts';

/** Everything a runner reads from its environment. */
export interface RunnerConfig {
  databaseUrl: string;
  /** Unique per process: host, pid and a random suffix (shown on runs and stored data). */
  runnerId: string;
  host: string;
  /** Jobs executed at the same time by this process. */
  slots: number;
  /** Expiry of a job before another runner retries it. */
  jobExpireSeconds: number;
  /** How often this runner runs pg-boss maintenance (expiring jobs of dead runners). */
  maintenanceSeconds: number;
  heartbeatMs: number;
  /** Largest size of one run's outputs (their JSON, as stored); larger outputs fail the run with a limit error. */
  runOutputMaxBytes: number;
  /** A runner silent for this long is presumed dead; a live runner takes its work over. */
  deadAfterSeconds: number;
  /** On SIGTERM/SIGINT: how long running jobs may finish before they are handed back. */
  stopGraceMs: number;
  pollMs: number;
  /** Levels up to this prime (≤ 23) are enumerated in one piece; deeper ones are streamed in chunks. */
  levelOnePieceUpTo: number;
  /** Base-cycle steps per level chunk job. */
  levelStepsPerChunk: number;
  /**
   * Chunked levels from this prime on take the recursion route (quadruples of the level before,
   * then the pair and histogram recursions) when it applies; smaller ones stream the level itself.
   */
  levelRecursionFrom: number;
  /**
   * Levels from this prime on (to 47) take the split route: chunks of base members, each giving
   * partial counts of every gap (see the engine's runSplitChunk).
   */
  levelSplitFrom: number;
  /** Chunk jobs of a split-route level. */
  levelSplitChunks: number;
  /** Test hook, honoured only with CRIBRA_ENV=test: pause inside each cell or chunk job after it started. */
  testPauseMs: number;
  env: string;
}

function positiveInt(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  const n = Number(value);
  if (!Number.isInteger(n) || n <= 0) throw new Error(`${name} must be a positive integer, got "${value}"`);
  return n;
}

export function readRunnerConfig(env: NodeJS.ProcessEnv = process.env): RunnerConfig {
  const host = hostname();
  const cribraEnv = env.CRIBRA_ENV ?? 'development';
  return {
    databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:4311/cribra',
    runnerId: env.CRIBRA_RUNNER_ID || `${host}-${process.pid}-${randomBytes(3).toString('hex')}`,
    host,
    slots: positiveInt(env.CRIBRA_RUNNER_SLOTS, Math.max(1, availableParallelism() - 1), 'CRIBRA_RUNNER_SLOTS'),
    jobExpireSeconds: positiveInt(env.CRIBRA_JOB_EXPIRE_SECONDS, QUEUE_DEFAULT_EXPIRE_SECONDS, 'CRIBRA_JOB_EXPIRE_SECONDS'),
    maintenanceSeconds: positiveInt(env.CRIBRA_QUEUE_MAINTENANCE_SECONDS, 30, 'CRIBRA_QUEUE_MAINTENANCE_SECONDS'),
    heartbeatMs: positiveInt(env.CRIBRA_RUNNER_HEARTBEAT_MS, 5000, 'CRIBRA_RUNNER_HEARTBEAT_MS'),
    runOutputMaxBytes: positiveInt(env.CRIBRA_RUN_OUTPUT_MAX_BYTES, RUN_OUTPUT_MAX_BYTES, 'CRIBRA_RUN_OUTPUT_MAX_BYTES'),
    deadAfterSeconds: positiveInt(env.CRIBRA_RUNNER_DEAD_AFTER_SECONDS, 30, 'CRIBRA_RUNNER_DEAD_AFTER_SECONDS'),
    stopGraceMs: positiveInt(env.CRIBRA_RUNNER_STOP_GRACE_MS, 10_000, 'CRIBRA_RUNNER_STOP_GRACE_MS'),
    pollMs: positiveInt(env.CRIBRA_RUNNER_POLL_MS, 500, 'CRIBRA_RUNNER_POLL_MS'),
    levelOnePieceUpTo: positiveInt(env.CRIBRA_LEVEL_ONE_PIECE_UP_TO, 23, 'CRIBRA_LEVEL_ONE_PIECE_UP_TO'),
    levelStepsPerChunk: positiveInt(env.CRIBRA_LEVEL_STEPS_PER_CHUNK, 1e9, 'CRIBRA_LEVEL_STEPS_PER_CHUNK'),
    levelRecursionFrom: positiveInt(env.CRIBRA_LEVEL_RECURSION_FROM, 29, 'CRIBRA_LEVEL_RECURSION_FROM'),
    levelSplitFrom: positiveInt(env.CRIBRA_LEVEL_SPLIT_FROM, 41, 'CRIBRA_LEVEL_SPLIT_FROM'),
    levelSplitChunks: positiveInt(env.CRIBRA_LEVEL_SPLIT_CHUNKS, 32, 'CRIBRA_LEVEL_SPLIT_CHUNKS'),
    testPauseMs:
      cribraEnv === 'test' && env.CRIBRA_RUNNER_TEST_PAUSE_MS
        ? positiveInt(env.CRIBRA_RUNNER_TEST_PAUSE_MS, 0, 'CRIBRA_RUNNER_TEST_PAUSE_MS')
        : 0,
    env: cribraEnv,
  };
}
