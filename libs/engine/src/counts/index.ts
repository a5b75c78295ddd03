// Exact counts at any wheel level: occurrences of admissible tuples, consecutive gaps and gap
// patterns by inclusion–exclusion, and their closed forms.
export * from './occurrences';
export * from './closed-form';
export * from './enumerated';
export * from './split-window';
export * from './split-counts';
