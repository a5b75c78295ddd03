import { Alert, Link } from '@mui/material';
import { Link as RouterLink, useParams, useSearchParams } from 'react-router-dom';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { AuthCard } from '../components/auth-card';
import { ResetPasswordForm } from '../components/reset-password-form';

/** Reached from the e-mailed link: `/reset/:token` or `/reset?token=…`. */
export default function ResetPasswordPage() {
  useDocumentTitle('Choose a new password');
  const { token: fromPath } = useParams();
  const [params] = useSearchParams();
  const token = fromPath ?? params.get('token') ?? '';
  return (
    <AuthCard title="Choose a new password" footer={<Link component={RouterLink} to="/sign-in">Back to sign-in</Link>}>
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <Alert severity="error">
          This link has no reset token. <Link component={RouterLink} to="/reset">Ask for a new link</Link>.
        </Alert>
      )}
    </AuthCard>
  );
}
