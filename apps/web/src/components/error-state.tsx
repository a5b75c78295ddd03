import { Alert, Button } from '@mui/material';
import { errorMessage } from '../lib/api-error';

interface Props {
  error: unknown;
  title?: string;
  onRetry?: () => void;
}

export function ErrorState({ error, title = 'Could not load this', onRetry }: Props) {
  return (
    <Alert
      severity="error"
      sx={{ my: 2 }}
      action={onRetry ? <Button color="inherit" onClick={onRetry}>Try again</Button> : undefined}
    >
      <strong>{title}.</strong> {errorMessage(error)}
    </Alert>
  );
}
