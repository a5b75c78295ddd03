/** Largest k for which the constructions run (time grows like k²/log k: k = 50 000 takes about 25 s of CPU). */
export const CONSTRUCT_MAX_K = 50_000;
