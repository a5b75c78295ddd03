// Node-only entry (`@cribra/engine/node`): parallel drivers over worker_threads.
// The pure entry (`@cribra/engine`) must stay loadable in a browser.
export * from './wheel-pool';
export * from './sieve-parallel';
export * from './narrow-parallel';
export * from './wasm-kernel';
export * from './split-pool';
