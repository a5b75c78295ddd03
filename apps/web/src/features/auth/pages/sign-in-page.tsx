import { Link } from '@mui/material';
import { Link as RouterLink, useNavigate, useSearchParams } from 'react-router-dom';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { safeNextPath } from '../../../lib/validation';
import { AuthCard } from '../components/auth-card';
import { SignInForm } from '../components/sign-in-form';

export default function SignInPage() {
  useDocumentTitle('Sign in');
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(params.get('next'));
  // An invitation's link passes the invited address on (`?email=`); it is only a default.
  const email = params.get('email') ?? '';
  const signUpQuery = new URLSearchParams();
  if (params.get('next')) signUpQuery.set('next', next);
  if (email) signUpQuery.set('email', email);
  return (
    <AuthCard
      title="Sign in"
      footer={
        <>
          <Link component={RouterLink} to={`/sign-up${signUpQuery.size ? `?${signUpQuery}` : ''}`}>Create an account</Link>
          <Link component={RouterLink} to="/reset">Forgot your password?</Link>
        </>
      }
    >
      <SignInForm initialEmail={email} onSignedIn={() => navigate(next, { replace: true })} />
    </AuthCard>
  );
}
