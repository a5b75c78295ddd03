import { Chip, Grid, Paper, Typography } from '@mui/material';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { PageHeader } from '../../../components/page-header';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { useCurrentUser } from '../../../lib/current-user';
import { formatDateTime } from '../../../lib/format';
import { ChangePasswordForm } from '../components/change-password-form';
import { ProfileForm } from '../components/profile-form';

export default function AccountPage() {
  useDocumentTitle('Account');
  const me = useCurrentUser();
  if (me.isPending) return <LoadingState />;
  if (me.isError || !me.data) return <ErrorState error={me.error} onRetry={() => me.refetch()} />;
  const user = me.data;
  return (
    <>
      <PageHeader
        title="Account"
        subtitle={<>Member since {formatDateTime(user.createdAt)} · site role <Chip size="small" label={user.siteRole} /></>}
      />
      <Grid container spacing={3} sx={{ maxWidth: 960 }}>
        <Grid size={{ xs: 12, md: 6 }}>
          <Paper component="section" aria-labelledby="profile-heading" sx={{ p: 3 }}>
            <Typography id="profile-heading" variant="h3" component="h2" sx={{ mb: 2 }}>Profile</Typography>
            <ProfileForm user={user} />
          </Paper>
        </Grid>
        <Grid size={{ xs: 12, md: 6 }}>
          <Paper component="section" aria-labelledby="password-heading" sx={{ p: 3 }}>
            <Typography id="password-heading" variant="h3" component="h2" sx={{ mb: 2 }}>Password</Typography>
            <ChangePasswordForm />
          </Paper>
        </Grid>
      </Grid>
    </>
  );
}
