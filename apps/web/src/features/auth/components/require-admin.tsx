import { Alert } from '@mui/material';
import type { ReactNode } from 'react';
import { useCurrentUser } from '../../../lib/current-user';

/** Inside RequireSignedIn: shows a refusal to members instead of an admin page. */
export function RequireAdmin({ children }: { children: ReactNode }) {
  const me = useCurrentUser();
  if (me.data?.siteRole !== 'admin') {
    return <Alert severity="warning">This page is for site administrators.</Alert>;
  }
  return <>{children}</>;
}
