import { lazy } from 'react';
import { useSearchParams } from 'react-router-dom';

const RequestResetPage = lazy(() => import('../../features/auth/pages/request-reset-page'));
const ResetPasswordPage = lazy(() => import('../../features/auth/pages/reset-password-page'));

/** `/reset` asks for a link; `/reset?token=…` (a mailed link) sets the new password. */
export default function ResetRoute() {
  const [params] = useSearchParams();
  return params.get('token') ? <ResetPasswordPage /> : <RequestResetPage />;
}
