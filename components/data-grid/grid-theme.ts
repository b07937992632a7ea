import { themeQuartz } from 'ag-grid-community';

// The grid draws its own DOM, so it cannot read Tailwind classes: these values mirror
// tailwind.config.ts (surface, ink, action, copper). Change both together.
const palette = {
  surface: '#ffffff',
  surfaceMuted: '#f6f4f1',
  surfaceLine: '#ddd7cf',
  ink: '#1f2326',
  inkMuted: '#565c61',
  action: '#0f5e63',
  actionSoft: '#e3f0f0',
  copperSoft: '#f7e9df',
} as const;

export const gridTheme = themeQuartz.withParams({
  browserColorScheme: 'light',
  accentColor: palette.action,
  backgroundColor: palette.surface,
  foregroundColor: palette.ink,
  textColor: palette.ink,
  borderColor: palette.surfaceLine,
  chromeBackgroundColor: palette.surfaceMuted,
  headerBackgroundColor: palette.surfaceMuted,
  headerTextColor: palette.inkMuted,
  headerFontWeight: 600,
  rowHoverColor: palette.actionSoft,
  selectedRowBackgroundColor: palette.copperSoft,
  fontFamily: 'var(--font-sans), system-ui, sans-serif',
  fontSize: 14,
  dataFontSize: 14,
  headerFontSize: 13,
  // Dense enough for office screens while rows stay easy to click.
  spacing: 6,
  rowHeight: 38,
  headerHeight: 40,
  wrapperBorderRadius: 8,
  borderRadius: 6,
  columnBorder: false,
});
