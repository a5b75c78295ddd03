import { Link } from '@mui/material';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router-dom';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { safeNextPath } from '../../../lib/validation';
import { AuthCard } from '../components/auth-card';
import { SignUpForm } from '../components/sign-up-form';

export default function SignUpPage() {
  useDocumentTitle('Create an account');
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <AuthCard title="Create an account" footer={<Link component={RouterLink} to="/sign-in">I already have an account</Link>}>
      <SignUpForm
        invitationToken={params.get('invitation') ?? undefined}
        initialEmail={params.get('email') ?? ''}
        onSignedUp={() => navigate(safeNextPath(params.get('next')), { replace: true })}
      />
    </AuthCard>
  );
}
