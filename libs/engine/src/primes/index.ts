export * from './small-primes';
export * from './is-prime';
