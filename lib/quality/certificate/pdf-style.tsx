// Colours, text styles and small pieces shared by the certificate PDF's page and sections.
// @react-pdf is ES-module only and the seed and bench scripts (tsx, CommonJS) reach it only through
// import(), so the primitives arrive as a `kit` (the loaded module) instead of static imports.
import type { Styles } from '@react-pdf/renderer';
import { fromStorage } from '@/lib/plating';

export type Kit = typeof import('@react-pdf/renderer');

export const TEAL = '#0f5f5c';
export const COPPER = '#a4582a';
export const INK = '#1f2426';
export const MUTED = '#5b6367';

export const pdfStyles = {
  // Line height lives on the body (with its own font size, or rows double in height), not the page:
  // on the page it hid the absolutely placed footer and its page numbers (seen with @react-pdf 4.9).
  page: { fontFamily: 'Plex Sans', fontSize: 9, color: INK, paddingTop: 36, paddingBottom: 48, paddingHorizontal: 40 },
  body: { lineHeight: 1.35, fontSize: 9 },
  shop: { fontSize: 14, fontWeight: 600, lineHeight: 1.25 },
  muted: { color: MUTED },
  rule: { borderBottomWidth: 2, borderBottomColor: TEAL, marginVertical: 8 },
  title: { fontSize: 16, fontWeight: 600, color: TEAL, lineHeight: 1.25 },
  number: { fontFamily: 'Plex Mono', fontSize: 11, color: COPPER, lineHeight: 1.3, marginTop: 2 },
  section: { marginTop: 12 },
  h2: { fontSize: 10.5, fontWeight: 600, color: TEAL, marginBottom: 4, textTransform: 'none' },
  grid: { flexDirection: 'row', flexWrap: 'wrap' },
  cell: { width: '50%', flexDirection: 'row', paddingVertical: 1.5 },
  label: { width: 92, color: MUTED },
  value: { flex: 1 },
  mono: { fontFamily: 'Plex Mono' },
  row: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: '#d5d2cc', paddingVertical: 2 },
  head: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: INK, paddingVertical: 2, fontWeight: 600 },
  footer: { position: 'absolute', bottom: 22, left: 40, right: 40, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: MUTED },
  signature: { marginTop: 14, flexDirection: 'row', borderTopWidth: 1, borderTopColor: INK, paddingTop: 6 },
} satisfies Styles;

export const um = (v: number | null | undefined) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v.toFixed(2)} µm (${fromStorage(v, 'mil').toFixed(3)} mil)`;

export function Fact({ k, label, value }: { k: Kit; label: string; value: string }) {
  const { Text, View } = k;
  return (
    <View style={pdfStyles.cell}>
      <Text style={pdfStyles.label}>{label}</Text>
      <Text style={pdfStyles.value}>{value || '—'}</Text>
    </View>
  );
}

