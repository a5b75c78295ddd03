// Worker thread of the parallel sieve: sieves the blocks it is sent and answers with their JSON summaries.
import { parentPort, workerData } from 'node:worker_threads';
import { EngineError } from '../errors';
import { primeBlockToJson, sievePrimeBlock } from '../sieve';
import type { SieveTask, SieveTaskReply } from './sieve-messages';
import { kernelFor, useSieveKernelModule, type KernelModule } from './wasm-kernel';

// The parent compiled the kernel once and posted the module: this thread only instantiates it.
const data = workerData as { kernelModule?: KernelModule } | null;
if (data?.kernelModule) useSieveKernelModule(data.kernelModule);

parentPort?.on('message', (task: SieveTask) => {
  let reply: SieveTaskReply;
  try {
    const kernel = kernelFor(task.kernel) ?? undefined;
    const block = sievePrimeBlock(task.from, task.to, { gaps: task.gaps, patterns: task.patterns, kernel });
    reply = { id: task.id, block: primeBlockToJson(block) };
  } catch (e) {
    const kind = e instanceof EngineError ? e.kind : 'limit';
    reply = { id: task.id, error: { kind, message: e instanceof Error ? e.message : String(e) } };
  }
  parentPort!.postMessage(reply);
});
