// Public surface of the Cribra engine: pure number theory, no I/O, no framework.
// Each area owns its folder and its own index; add exports there, not here.
export * from './version';
export * from './errors';
export * from './primes';
export * from './tuple';
export * from './wheel';
export * from './counts';
export * from './fit';
export * from './sieve';
export * from './hl';
export * from './narrow';
