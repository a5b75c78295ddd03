import { Box, Paper, Typography } from '@mui/material';
import type { ReactNode } from 'react';
import { monoFont } from '../../../lib/design-tokens';

interface Props {
  title: string;
  children: ReactNode;
  footer?: ReactNode;
}

/** The narrow sheet on which the signed-out pages sit. */
export function AuthCard({ title, children, footer }: Props) {
  return (
    <Box component="main" sx={{ minHeight: '100vh', display: 'grid', placeItems: 'center', p: 2 }}>
      <Box sx={{ width: '100%', maxWidth: 400 }}>
        <Typography sx={{ fontFamily: monoFont, fontWeight: 600, letterSpacing: '0.12em', fontSize: 20, mb: 0.5 }}>
          CRIBRA
        </Typography>
        <Typography color="text.secondary" sx={{ mb: 2 }}>
          Research notebooks for admissible tuples, prime constellations and wheel gaps.
        </Typography>
        <Paper sx={{ p: 3 }}>
          <Typography variant="h2" component="h1" sx={{ mb: 2 }}>{title}</Typography>
          {children}
        </Paper>
        {footer && <Box sx={{ mt: 2, display: 'flex', gap: 2, justifyContent: 'space-between' }}>{footer}</Box>}
      </Box>
    </Box>
  );
}
