import { Box, CircularProgress, Typography } from '@mui/material';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <Box role="status" aria-live="polite" sx={{ display: 'flex', alignItems: 'center', gap: 1.5, py: 4, justifyContent: 'center' }}>
      <CircularProgress size={18} aria-hidden />
      <Typography color="text.secondary">{label}</Typography>
    </Box>
  );
}
