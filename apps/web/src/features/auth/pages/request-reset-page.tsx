import { Link, Typography } from '@mui/material';
import { Link as RouterLink } from 'react-router-dom';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { AuthCard } from '../components/auth-card';
import { RequestResetForm } from '../components/request-reset-form';

export default function RequestResetPage() {
  useDocumentTitle('Reset your password');
  return (
    <AuthCard title="Reset your password" footer={<Link component={RouterLink} to="/sign-in">Back to sign-in</Link>}>
      <Typography color="text.secondary" sx={{ mb: 2 }}>
        We will e-mail you a link to choose a new password.
      </Typography>
      <RequestResetForm />
    </AuthCard>
  );
}
