// A Cribra runner: `node apps/runner/dist/main.js` (or `npm run runner`). Point DATABASE_URL at the
// shared PostgreSQL to add capacity from any machine; see docs/scaling.md.
import { Runner } from './runner';
import { readRunnerConfig } from './runner-config';
import { createExecutor } from './sift/create-executor';

async function main(): Promise<void> {
  const cfg = readRunnerConfig();
  const runner = new Runner(cfg, await createExecutor(cfg));
  let stopping = false;
  const stop = (signal: string): void => {
    if (stopping) return;
    stopping = true;
    runner.log(`${signal}: finishing running jobs, then stopping`);
    runner
      .stop()
      .then(() => process.exit(0))
      .catch(() => process.exit(1));
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
  await runner.start();
}

main().catch((err: unknown) => {
  console.error(`The runner could not start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
