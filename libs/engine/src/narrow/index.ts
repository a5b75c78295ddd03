// Narrow admissible tuples: exact H(k) and constructions for large k.
export * from './types';
export * from './narrow-admissibility';
export * from './minimal-diameter';
export * from './interval-sieve';
export * from './narrowest-window';
export * from './narrow-result';
export * from './greedy-greedy';
export * from './hensley-richards';
export * from './schinzel-sieve';
export * from './improve-tuple';
export * from './narrow-tuple';
export * from './random';
export * from './sieve-state';
export * from './local-search';
export * from './narrow-search';
