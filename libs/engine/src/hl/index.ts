// Hardy–Littlewood: singular series, Li_k, predictions beside actual counts, crossings.
export * from './singular-series';
export * from './log-integral';
export * from './prediction';
export { ZetaAtIntegers } from './zeta';
export { PrimeZetaTail, moebius } from './prime-zeta';
