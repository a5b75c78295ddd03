// Keeps one long-running child up: when it exits on its own it is started again after a back-off
// (doubling from `initialMs` up to `maxMs`; back to `initialMs` once a start stayed up `stableMs`),
// with a log line each time. Node built-ins only (runs before `npm install`).

/**
 * `start()` spawns the child and returns it (a ChildProcess); `stopChild(child)` ends it (returns
 * a promise). Returns a handle: `child` (the current process), `restarts`, `stop()`.
 * `log(message)` receives the lines about exits and restarts.
 */
export function supervise({ name, start, stopChild, log, initialMs = 1000, maxMs = 30_000, stableMs = 60_000, onRestart }) {
  let stopped = false;
  let timer = null;
  let delay = initialMs;
  const handle = { name, child: null, restarts: 0, stop };

  function launch() {
    timer = null;
    if (stopped) return;
    const startedAt = Date.now();
    let child;
    try {
      child = start();
    } catch (e) {
      log(`${name} could not be started (${e.message}); trying again in ${(delay / 1000).toFixed(1)} s`);
      schedule();
      return;
    }
    handle.child = child;
    child.once('error', (e) => log(`${name}: ${e.message}`));
    child.once('exit', (code, signal) => {
      if (stopped) return;
      // A start that stayed up a while was healthy: the next failure starts the back-off afresh.
      if (Date.now() - startedAt >= stableMs) delay = initialMs;
      log(`${name} exited (${signal ?? `exit code ${code}`}); restarting it in ${(delay / 1000).toFixed(1)} s (restart ${handle.restarts + 1})`);
      schedule();
    });
    if (handle.restarts > 0 && onRestart) onRestart(child);
  }

  function schedule() {
    const wait = delay;
    delay = Math.min(maxMs, delay * 2);
    timer = setTimeout(() => {
      handle.restarts += 1;
      launch();
    }, wait);
  }

  async function stop() {
    stopped = true;
    if (timer) clearTimeout(timer);
    timer = null;
    if (handle.child) await stopChild(handle.child);
  }

  launch();
  return handle;
}
