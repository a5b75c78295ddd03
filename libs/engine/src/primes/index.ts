export * from './small-primes';
