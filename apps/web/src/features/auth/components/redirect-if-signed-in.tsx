import type { ReactNode } from 'react';
import { Navigate, useSearchParams } from 'react-router-dom';
import { LoadingState } from '../../../components/loading-state';
import { useCurrentUser } from '../../../lib/current-user';
import { safeNextPath } from '../../../lib/validation';

/** Signed-out pages (sign-in, sign-up) send an already signed-in reader on to where they were going. */
export function RedirectIfSignedIn({ children }: { children: ReactNode }) {
  const me = useCurrentUser();
  const [params] = useSearchParams();
  if (me.isPending) return <LoadingState />;
  if (me.data) return <Navigate to={safeNextPath(params.get('next'))} replace />;
  return <>{children}</>;
}
