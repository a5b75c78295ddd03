import type { DataSource } from 'typeorm';
import type PgBoss from 'pg-boss';
import { checkLevel, EngineError, primorial, primorialTotient } from '@cribra/engine';
import { LEDGER_BLOCK_SIZE, LEDGER_MAX_END, MAX_STORED_LEVEL, QUEUES, type PlanJob } from '@cribra/contracts';
import { jobOptions } from './queue-options';

/** Deepest wheel level the runners compute (the engine's SPLIT_MAX_LEVEL: 37# … 47# by the split route). */
export const MAX_REQUESTABLE_LEVEL = MAX_STORED_LEVEL;

/** A request that cannot be honoured; the caller turns it into a 400 with this message. */
export class ComputationRequestError extends Error {
  constructor(
    message: string,
    readonly field: string,
  ) {
    super(message);
  }
}

export interface LevelRequestOutcome {
  computationId: string;
  created: boolean;
}

/**
 * Makes sure wheel level `prime` is stored or being computed: creates its row and a computation
 * (with a plan job for the runners) unless one is stored or in progress. Shared by the API route
 * and the start-up seeding, so both behave the same. Idempotent under concurrency (row lock).
 */
export async function requestLevel(db: DataSource, boss: PgBoss, prime: number, requestedBy: string | null): Promise<LevelRequestOutcome> {
  try {
    checkLevel(prime, MAX_REQUESTABLE_LEVEL);
  } catch (err) {
    if (err instanceof EngineError) throw new ComputationRequestError(err.message, 'prime');
    throw err;
  }
  const outcome = await db.transaction(async (m) => {
    await m.query(
      `INSERT INTO wheel_levels (prime, modulus, phi) VALUES ($1, $2, $3) ON CONFLICT (prime) DO NOTHING`,
      [prime, primorial(prime).toString(), primorialTotient(prime).toString()],
    );
    const [level] = await m.query(
      `SELECT l.status, l.computation_id, c.status AS computation_status
         FROM wheel_levels l LEFT JOIN computations c ON c.id = l.computation_id
        WHERE l.prime = $1 FOR UPDATE OF l`,
      [prime],
    );
    const active = level.computation_status === 'queued' || level.computation_status === 'running';
    if (level.computation_id && (level.status === 'stored' || active)) {
      return { computationId: level.computation_id as string, created: false };
    }
    const [{ id }] = await m.query(
      `INSERT INTO computations (kind, params, requested_by) VALUES ('level', $1, $2) RETURNING id`,
      [JSON.stringify({ prime }), requestedBy],
    );
    await m.query(`UPDATE wheel_levels SET status = 'pending', computation_id = $2 WHERE prime = $1`, [prime, id]);
    return { computationId: id as string, created: true };
  });
  if (outcome.created) await sendPlan(boss, outcome.computationId);
  return outcome;
}

/** Parses a decimal range end of the ledger (0 ≤ n ≤ LEDGER_MAX_END). */
function parseEnd(value: string, field: string): bigint {
  if (!/^\d{1,15}$/.test(value)) throw new ComputationRequestError(`${field} must be a whole number from 0 to ${LEDGER_MAX_END}`, field);
  const n = BigInt(value);
  if (n > BigInt(LEDGER_MAX_END)) throw new ComputationRequestError(`${field} must be at most ${LEDGER_MAX_END}`, field);
  return n;
}

/** Ledger blocks covering [from, to): the range widened to whole blocks. */
export function blocksOf(from: string, to: string): { first: number; last: number } {
  const a = parseEnd(from, 'from');
  const b = parseEnd(to, 'to');
  if (b <= a) throw new ComputationRequestError('to must be greater than from', 'to');
  const w = BigInt(LEDGER_BLOCK_SIZE);
  return { first: Number(a / w), last: Number((b - 1n) / w) };
}

/** Creates a ledger computation for the blocks of [from, to) not yet stored, and its plan job. */
export async function requestLedgerRange(db: DataSource, boss: PgBoss, from: string, to: string, requestedBy: string | null): Promise<string> {
  const { first, last } = blocksOf(from, to);
  const [{ stored }] = await db.query(
    `SELECT count(*)::int AS stored FROM ledger_blocks WHERE block_index BETWEEN $1 AND $2`,
    [first, last],
  );
  const total = last - first + 1;
  const done = stored === total;
  const [{ id }] = await db.query(
    `INSERT INTO computations (kind, params, requested_by, chunks_total, chunks_done, status, finished_at)
     VALUES ('ledger', $1, $2, $3, $4, $5::varchar, CASE WHEN $5::varchar = 'succeeded' THEN now() END) RETURNING id`,
    [JSON.stringify({ from, to, firstBlock: first, lastBlock: last }), requestedBy, total, stored, done ? 'succeeded' : 'queued'],
  );
  if (!done) await sendPlan(boss, id);
  return id;
}

async function sendPlan(boss: PgBoss, computationId: string): Promise<void> {
  const job: PlanJob = { computationId };
  await boss.send(QUEUES.plan, job, { ...jobOptions(), singletonKey: computationId });
}
