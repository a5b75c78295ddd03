import { INVITATION_PATH, RECORDS_PATH, RESET_PASSWORD_PATH } from '@cribra/contracts';
import { lazy, Suspense } from 'react';
import { Navigate, Outlet, type RouteObject } from 'react-router-dom';
import { LoadingState } from '../../components/loading-state';
import { RequireAdmin } from '../../features/auth/components/require-admin';
import { SignedInLayout } from '../layouts/signed-in-layout';
import { SignedOutLayout } from '../layouts/signed-out-layout';

// Every page is its own chunk: the first page loads only the frame, the router and itself.
const SignInPage = lazy(() => import('../../features/auth/pages/sign-in-page'));
const SignUpPage = lazy(() => import('../../features/auth/pages/sign-up-page'));
const ResetPasswordPage = lazy(() => import('../../features/auth/pages/reset-password-page'));
const ResetRoute = lazy(() => import('./reset-route'));
const NotebooksPage = lazy(() => import('../../features/notebooks/pages/notebooks-page'));
const NotebookRoute = lazy(() => import('./notebook-route'));
const DataPage = lazy(() => import('../../features/data/pages/data-page'));
const AccountPage = lazy(() => import('../../features/account/pages/account-page'));
const AdminUsersPage = lazy(() => import('../../features/admin/pages/admin-users-page'));
const InvitationPage = lazy(() => import('../../features/invitations/pages/invitation-page'));
const NotFoundPage = lazy(() => import('./not-found-page'));
const RecordPage = lazy(() => import('../../features/records/pages/record-page'));

function Plain() {
  return (
    <Suspense fallback={<LoadingState />}>
      <Outlet />
    </Suspense>
  );
}

export const routes: RouteObject[] = [
  {
    element: <SignedOutLayout />,
    children: [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/sign-up', element: <SignUpPage /> },
    ],
  },
  {
    element: <Plain />,
    children: [
      { path: '/reset', element: <ResetRoute /> },
      { path: '/reset/:token', element: <ResetPasswordPage /> },
      // The e-mailed link: `${RESET_PASSWORD_PATH}?token=…`.
      { path: RESET_PASSWORD_PATH, element: <ResetPasswordPage /> },
      // The e-mailed invitation link; works signed out (sign in or sign up on the page).
      { path: `${INVITATION_PATH}/:token`, element: <InvitationPage /> },
      // A published record: public, readable without signing in.
      { path: `${RECORDS_PATH}/:id`, element: <RecordPage /> },
    ],
  },
  {
    element: <SignedInLayout />,
    children: [
      { path: '/', element: <Navigate to="/notebooks" replace /> },
      { path: '/notebooks', element: <NotebooksPage /> },
      { path: '/notebooks/:id', element: <NotebookRoute /> },
      { path: '/data', element: <DataPage /> },
      { path: '/account', element: <AccountPage /> },
      { path: '/admin/users', element: <RequireAdmin><AdminUsersPage /></RequireAdmin> },
      { path: '/admin', element: <Navigate to="/admin/users" replace /> },
    ],
  },
  { element: <Plain />, children: [{ path: '*', element: <NotFoundPage /> }] },
];
