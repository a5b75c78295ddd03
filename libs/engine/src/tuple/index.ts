// Tuples: parsing, normalization, occupancy ν_q(H), admissibility with witness or obstruction.
export * from './normalize';
export * from './occupancy';
export * from './admissibility';
