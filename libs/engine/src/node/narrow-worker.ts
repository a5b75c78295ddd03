// Worker thread of the parallel narrow-tuple search: runs its pieces until the deadline and reports
// every narrower tuple (at most twice a second) and its final best.
import { parentPort } from 'node:worker_threads';
import { EngineError } from '../errors';
import { narrowTuple, runSearchPiece, type NarrowTuple } from '../narrow';
import type { NarrowTask, NarrowTaskReply } from './narrow-messages';

const REPORT_EVERY_MS = 500;

parentPort?.on('message', (task: NarrowTask) => {
  const post = (reply: NarrowTaskReply) => parentPort!.postMessage(reply);
  try {
    if ('baseline' in task) {
      const base = narrowTuple(task.baseline);
      post({ type: 'done', tuple: base.tuple, pieces: 0, method: base.method });
      return;
    }
    let best: NarrowTuple | null = null;
    let lastReport = 0;
    let start = task.start;
    const n = task.pieces.length;
    const t0 = Date.now();
    task.pieces.forEach((piece, i) => {
      // Equal shares of the remaining time; the last piece runs to the deadline.
      const end = t0 + ((task.deadline - t0) * (i + 1)) / n;
      if (Date.now() >= task.deadline) return;
      const found = runSearchPiece(piece, {
        timeUp: () => Date.now() >= end,
        start,
        onBest: (t) => {
          if (best && t.diameter >= best.diameter) return;
          best = t;
          if (Date.now() - lastReport >= REPORT_EVERY_MS) {
            lastReport = Date.now();
            post({ type: 'best', tuple: t.tuple });
          }
        },
      });
      if (!best || found.diameter < best.diameter) best = found;
      start = best.tuple;
    });
    // The deadline may have passed before the first piece (a budget shorter than the baseline).
    const final = best ? (best as NarrowTuple).tuple : task.start;
    if (!final) throw new EngineError('limit', 'narrow search: no piece ran before the deadline');
    post({ type: 'done', tuple: final, pieces: n });
  } catch (e) {
    post({ type: 'error', kind: e instanceof EngineError ? e.kind : 'limit', message: e instanceof Error ? e.message : String(e) });
  }
});
