import { Box, Button, Typography } from '@mui/material';
import { Link as RouterLink, useLocation } from 'react-router-dom';
import { useDocumentTitle } from '../../hooks/use-document-title';
import { monoFont } from '../../lib/design-tokens';

export default function NotFoundPage() {
  useDocumentTitle('Not found');
  const { pathname } = useLocation();
  return (
    <Box component="main" sx={{ maxWidth: 560, mx: 'auto', py: 10, px: 2 }}>
      <Typography sx={{ fontFamily: monoFont, color: 'text.secondary', mb: 1 }}>404</Typography>
      <Typography variant="h1" gutterBottom>Nothing at this address</Typography>
      <Typography color="text.secondary" sx={{ mb: 3 }}>
        <Box component="code" sx={{ wordBreak: 'break-all' }}>{pathname}</Box> does not lead to a page of Cribra.
        It may have been mistyped, or the notebook may have been removed.
      </Typography>
      <Button component={RouterLink} to="/notebooks" variant="contained">Go to notebooks</Button>
    </Box>
  );
}
