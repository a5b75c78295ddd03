import { Typography } from '@mui/material';

export function OutputLabel({ children }: { children: string | null | undefined }) {
  if (!children) return null;
  return <Typography variant="overline" component="p" color="text.secondary" sx={{ lineHeight: 1.6 }}>{children}</Typography>;
}
