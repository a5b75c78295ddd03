import { Suspense } from 'react';
import { Outlet, useNavigate } from 'react-router-dom';
import { AppFrame, type NavItem } from '../../components/app-frame';
import { LoadingState } from '../../components/loading-state';
import { useSignOut } from '../../features/auth/api/sign-out';
import { RequireSignedIn } from '../../features/auth/components/require-signed-in';
import { useCurrentUser } from '../../lib/current-user';

const baseNav: NavItem[] = [
  { to: '/notebooks', label: 'Notebooks' },
  { to: '/data', label: 'Data' },
  { to: '/account', label: 'Account' },
];

function Frame() {
  const me = useCurrentUser();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const user = me.data!;
  const nav = user.siteRole === 'admin' ? [...baseNav, { to: '/admin/users', label: 'Admin' }] : baseNav;
  return (
    <AppFrame
      nav={nav}
      userLabel={user.displayName || user.email}
      signingOut={signOut.isPending}
      onSignOut={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })}
    >
      <Suspense fallback={<LoadingState />}>
        <Outlet />
      </Suspense>
    </AppFrame>
  );
}

/** Every signed-in page: guard, then the frame with the page inside. */
export function SignedInLayout() {
  return (
    <RequireSignedIn>
      <Frame />
    </RequireSignedIn>
  );
}
