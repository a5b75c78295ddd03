// Wheel levels: reduced residue systems mod p#, gap cycles, histograms, patterns, streamed chunks.
export * from './primorial';
export * from './tally';
export * from './level-gaps';
export * from './scan';
export * from './chunk';
export * from './recursion';
export * from './level';
export * from './pair-recursion';
export * from './quad-chunks';
