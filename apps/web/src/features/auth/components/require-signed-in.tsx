import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { useCurrentUser } from '../../../lib/current-user';

/** Renders its children for a signed-in user; otherwise sends the reader to sign-in and back here afterwards. */
export function RequireSignedIn({ children }: { children: ReactNode }) {
  const me = useCurrentUser();
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking your session…" />;
  if (me.isError) return <ErrorState error={me.error} title="Could not check your session" onRetry={() => me.refetch()} />;
  if (!me.data) {
    const next = `${location.pathname}${location.search}${location.hash}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <>{children}</>;
}
