import type { PresenceView } from '@cribra/contracts';
import { Box, Chip, Typography } from '@mui/material';

/** Who else has the notebook open (a light line under the header). */
export function PresenceBar({ others }: { others: PresenceView[] }) {
  if (!others.length) return null;
  return (
    <Box component="section" aria-label="Also here" sx={{ display: 'flex', alignItems: 'center', gap: 0.75, mb: 1.5, flexWrap: 'wrap' }}>
      <Typography variant="caption" color="text.secondary">Also here:</Typography>
      {others.map((p) => (
        <Chip key={p.user.id} size="small" variant="outlined" label={p.user.displayName} />
      ))}
    </Box>
  );
}
