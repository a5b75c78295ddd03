// Node-only entry (`@cribra/lang/node`): the worker-thread pool and the data bridge.
// The main entry (`@cribra/lang`) stays loadable in a browser.
export { SiftPool, type SiftPoolOptions, type PoolRunOptions } from './pool';
export { WorkerDataAccess, serveData, DATA_WAIT_MS } from './bridge';
export type { WorkerTask, WorkerMessage, DataReply } from './protocol';
