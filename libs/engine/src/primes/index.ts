export * from './small-primes';
export * from './is-prime';
export * from './factor';
