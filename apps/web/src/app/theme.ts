import { createTheme } from '@mui/material/styles';
import { monoFont, palette, sansFont } from '../lib/design-tokens';

export const theme = createTheme({
  palette: {
    mode: 'light',
    primary: { main: palette.accent, dark: palette.accentDark, contrastText: '#ffffff' },
    secondary: { main: palette.ink },
    success: { main: palette.holds },
    error: { main: palette.fails },
    warning: { main: palette.pending },
    background: { default: palette.paper, paper: palette.sheet },
    text: { primary: palette.ink, secondary: palette.inkSoft },
    divider: palette.rule,
  },
  shape: { borderRadius: 3 },
  spacing: 6,
  typography: {
    fontFamily: sansFont,
    fontSize: 13,
    h1: { fontSize: '1.6rem', fontWeight: 600, letterSpacing: '-0.01em' },
    h2: { fontSize: '1.3rem', fontWeight: 600 },
    h3: { fontSize: '1.1rem', fontWeight: 600 },
    h4: { fontSize: '1rem', fontWeight: 600 },
    button: { textTransform: 'none', fontWeight: 500 },
    overline: { letterSpacing: '0.08em', fontWeight: 600 },
  },
  components: {
    MuiCssBaseline: {
      styleOverrides: {
        body: { fontVariantNumeric: 'tabular-nums' },
        'code, pre, kbd, .mono': { fontFamily: monoFont },
        '.visually-hidden': { position: 'absolute', width: 1, height: 1, overflow: 'hidden', clip: 'rect(0 0 0 0)', whiteSpace: 'nowrap' },
      },
    },
    MuiPaper: {
      defaultProps: { elevation: 0 },
      styleOverrides: { root: { border: `1px solid ${palette.rule}` } },
    },
    MuiAppBar: {
      defaultProps: { elevation: 0, color: 'inherit' },
      styleOverrides: { root: { borderWidth: '0 0 1px 0', backgroundColor: palette.sheet } },
    },
    MuiButton: { defaultProps: { disableElevation: true, size: 'small' } },
    MuiTextField: { defaultProps: { size: 'small', fullWidth: true } },
    MuiSelect: { defaultProps: { size: 'small' } },
    MuiTableCell: { styleOverrides: { root: { borderColor: palette.rule }, head: { fontWeight: 600 } } },
    MuiLink: { defaultProps: { underline: 'hover' } },
  },
});
