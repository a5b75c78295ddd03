// House palette: paper, ink and one accent (a deep verdigris) reserved for actions.
export const palette = {
  paper: '#f5f2ea',
  sheet: '#fcfbf7',
  rule: '#d9d3c4',
  ink: '#1e2328',
  inkSoft: '#55595e',
  accent: '#1f6b5c',
  accentDark: '#154b40',
  holds: '#2f6b2f',
  fails: '#a3321f',
  pending: '#8a6a1f',
} as const;

export const monoFont = '"IBM Plex Mono", ui-monospace, monospace';
export const sansFont = '"IBM Plex Sans", system-ui, sans-serif';
