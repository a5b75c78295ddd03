import type { RunnerConfig } from '../runner-config';
import { InThreadExecutor } from './lang-executor';
import type { SiftExecutor } from './sift-executor';

/** The executor this runner uses (see lang-executor.ts). */
export async function createExecutor(_cfg: RunnerConfig): Promise<SiftExecutor> {
  return new InThreadExecutor();
}
