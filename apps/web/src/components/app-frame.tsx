import { AppBar, Box, Button, Container, Link, Toolbar, Typography } from '@mui/material';
import type { ReactNode } from 'react';
import { NavLink, Link as RouterLink } from 'react-router-dom';
import { monoFont } from '../lib/design-tokens';

export interface NavItem {
  to: string;
  label: string;
}

interface Props {
  nav: NavItem[];
  userLabel: string;
  onSignOut: () => void;
  signingOut?: boolean;
  children: ReactNode;
}

/** The frame around every signed-in page: product mark, navigation, who is signed in. */
export function AppFrame({ nav, userLabel, onSignOut, signingOut, children }: Props) {
  return (
    <Box sx={{ minHeight: '100vh', display: 'flex', flexDirection: 'column' }}>
      <Link
        href="#main"
        sx={{ position: 'absolute', left: -9999, '&:focus': { left: 8, top: 8, zIndex: 2000, bgcolor: 'background.paper', p: 1 } }}
      >
        Skip to content
      </Link>
      <AppBar position="static">
        <Toolbar variant="dense" sx={{ gap: 3 }}>
          <Typography
            component={RouterLink}
            to="/notebooks"
            sx={{ fontFamily: monoFont, fontWeight: 600, fontSize: 17, letterSpacing: '0.12em', color: 'text.primary', textDecoration: 'none' }}
          >
            CRIBRA
          </Typography>
          <Box component="nav" aria-label="Main" sx={{ display: 'flex', gap: 0.5, flex: 1 }}>
            {nav.map((item) => (
              <Button
                key={item.to}
                component={NavLink}
                to={item.to}
                color="secondary"
                sx={{
                  px: 1.5,
                  borderRadius: 0,
                  borderBottom: '2px solid transparent',
                  transition: 'none',
                  '&.active': { borderBottomColor: 'primary.main', color: 'primary.dark', fontWeight: 600 },
                }}
              >
                {item.label}
              </Button>
            ))}
          </Box>
          <Typography color="text.secondary" data-testid="signed-in-as" noWrap sx={{ maxWidth: 260 }}>
            {userLabel}
          </Typography>
          <Button variant="outlined" color="secondary" onClick={onSignOut} disabled={signingOut}>
            Sign out
          </Button>
        </Toolbar>
      </AppBar>
      <Container component="main" id="main" tabIndex={-1} maxWidth="xl" sx={{ flex: 1, py: 3, outline: 'none' }}>
        {children}
      </Container>
    </Box>
  );
}
