import type { RunnerConfig } from '../runner-config';
import { PoolExecutor } from './lang-executor';
import type { SiftExecutor } from './sift-executor';

/** The executor of this runner: Sift's worker pool with one thread per slot. */
export async function createExecutor(cfg: RunnerConfig): Promise<SiftExecutor> {
  return new PoolExecutor(cfg.slots);
}
