import { Suspense } from 'react';
import { Outlet } from 'react-router-dom';
import { LoadingState } from '../../components/loading-state';
import { RedirectIfSignedIn } from '../../features/auth/components/redirect-if-signed-in';

export function SignedOutLayout() {
  return (
    <RedirectIfSignedIn>
      <Suspense fallback={<LoadingState />}>
        <Outlet />
      </Suspense>
    </RedirectIfSignedIn>
  );
}
