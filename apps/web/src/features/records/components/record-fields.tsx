import { Box, Typography } from '@mui/material';
import { monoFont } from '../../../lib/design-tokens';

const text = (v: unknown): string => (typeof v === 'string' ? v : JSON.stringify(v, null, 2));

/** Fields of the record shown as they are (name, then the value; objects as JSON). */
export function RecordFields({ fields, title }: { fields: Record<string, unknown>; title?: string }) {
  const entries = Object.entries(fields).filter(([, v]) => v !== undefined);
  if (!entries.length) return null;
  return (
    <Box component="section" aria-label={title ?? 'More of the record'} sx={{ mt: 1 }}>
      {title && <Typography variant="h3" component="h2" gutterBottom>{title}</Typography>}
      <Box component="dl" sx={{ display: 'grid', gridTemplateColumns: 'minmax(8rem, max-content) 1fr', columnGap: 2, rowGap: 0.5, m: 0 }}>
        {entries.map(([k, v]) => (
          <Box key={k} sx={{ display: 'contents' }}>
            <Typography component="dt" variant="body2" sx={{ fontWeight: 600 }}>{k}</Typography>
            <Box component="dd" sx={{ m: 0, fontFamily: monoFont, fontSize: 12, whiteSpace: 'pre-wrap', wordBreak: 'break-all', maxHeight: 240, overflow: 'auto' }}>{text(v)}</Box>
          </Box>
        ))}
      </Box>
    </Box>
  );
}
