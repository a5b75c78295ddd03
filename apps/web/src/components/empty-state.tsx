import { Box, Typography } from '@mui/material';
import type { ReactNode } from 'react';

interface Props {
  title: string;
  children?: ReactNode;
  action?: ReactNode;
}

export function EmptyState({ title, children, action }: Props) {
  return (
    <Box sx={{ border: 1, borderColor: 'divider', borderStyle: 'dashed', borderRadius: 1, p: 4, textAlign: 'center' }}>
      <Typography variant="h4" component="p" gutterBottom>{title}</Typography>
      {children && <Typography color="text.secondary" sx={{ mb: action ? 2 : 0 }}>{children}</Typography>}
      {action}
    </Box>
  );
}
