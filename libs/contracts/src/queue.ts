// Queue names and job payloads shared by the API (which enqueues) and the runners (which consume).
// All queues live in pg-boss (schema `pgboss`) in the main PostgreSQL database.

export const QUEUES = {
  /** Execute one run of one cell. */
  runCell: 'cribra-run-cell',
  /** Split a computation (level or ledger range) into chunk jobs. */
  plan: 'cribra-computation-plan',
  /** Compute one chunk of a wheel level. */
  levelChunk: 'cribra-level-chunk',
  /** Compute one prime-ledger block. */
  ledgerBlock: 'cribra-ledger-block',
  /** Combine the chunks of a finished computation and store the result. */
  combine: 'cribra-computation-combine',
} as const;
export type QueueName = (typeof QUEUES)[keyof typeof QUEUES];

export interface RunCellJob {
  runId: string;
}
export interface PlanJob {
  computationId: string;
}
export interface LevelChunkJob {
  computationId: string;
  prime: number;
  index: number;
  chunks: number;
  /** Level the target is streamed over; null: the level is enumerated in one piece. */
  base: number | null;
  /**
   * Recursion route: the chunk tallies the consecutive gap quadruples of this level (the level
   * before `prime`, streamed over `base`) with half-gap radix `radix`; the combine step derives
   * the level from them. Absent: the level itself is streamed.
   */
  quadsOf?: number;
  radix?: number;
  /**
   * Split route: the chunk is `index` of `chunks` groups of the members of level `base`; it yields
   * partial counts of every gap of `prime` (the combine step adds them and checks the identities).
   */
  split?: boolean;
}
export interface LedgerBlockJob {
  computationId: string | null;
  blockIndex: number;
}
export interface CombineJob {
  computationId: string;
}

/**
 * Retry policy of every queue: a job whose runner died (no completion before `expireInSeconds`)
 * is failed by pg-boss maintenance and retried by any runner. Tests shorten the expiry through
 * CRIBRA_JOB_EXPIRE_SECONDS.
 */
export const QUEUE_RETRY_LIMIT = 5;
export const QUEUE_DEFAULT_EXPIRE_SECONDS = 15 * 60;
