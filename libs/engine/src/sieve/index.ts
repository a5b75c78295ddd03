// Primes: segmented sieve over any range up to 10^15, combinable block summaries.
export * from './prime-block';
export * from './prime-block-json';
export * from './combine';
export { parseSieveRange, sievePrimeBlock, SIEVE_MAX_TO, type KernelOption, type RangeEnd, type SieveOptions } from './range';
export { KERNEL_MAX_TO, SieveKernel, type SieveKernelExports } from './kernel';
export * from './queries';
export { forEachPrimeBetween } from './walk';
export { checkStop, partHooks, type WorkHooks } from './progress';
export { compilePattern, MAX_PATTERN_DIAMETER, type CompiledPattern } from './pattern';
