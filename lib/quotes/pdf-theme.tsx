import 'server-only';
import path from 'node:path';
import { Font, StyleSheet, Text, View } from '@react-pdf/renderer';
import type { ComponentProps, ReactNode } from 'react';

// Fonts and styles shared by the quote and the traveler. The PDF renderer needs .woff (woff2
// renders blank); the files are IBM Plex under the SIL OFL (fonts/OFL-IBM-Plex.txt).
let registered = false;

export function registerPdfFonts(): void {
  if (registered) return;
  const dir = path.join(process.cwd(), 'fonts');
  Font.register({
    family: 'Plex Sans',
    fonts: [
      { src: path.join(dir, 'ibm-plex-sans-latin-400-normal.woff'), fontWeight: 400 },
      { src: path.join(dir, 'ibm-plex-sans-latin-600-normal.woff'), fontWeight: 600 },
      { src: path.join(dir, 'ibm-plex-sans-latin-700-normal.woff'), fontWeight: 700 },
    ],
  });
  // Part numbers and specification text must not be split at odd places.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}

// Mirrors the app's palette (tailwind.config.ts): deep teal for headings, warm greys, copper accent.
export const PDF_COLORS = { ink: '#1f2326', muted: '#565c61', line: '#ddd7cf', soft: '#f6f4f1', teal: '#0f5e63', copper: '#a4582c' } as const;

export const pdf = StyleSheet.create({
  page: { fontFamily: 'Plex Sans', fontSize: 9, color: PDF_COLORS.ink, paddingTop: 36, paddingBottom: 48, paddingHorizontal: 40, lineHeight: 1.35 },
  header: { flexDirection: 'row', justifyContent: 'space-between', borderBottomWidth: 2, borderBottomColor: PDF_COLORS.teal, paddingBottom: 10, marginBottom: 14 },
  shopName: { fontSize: 15, fontWeight: 700, color: PDF_COLORS.teal, lineHeight: 1.2, marginBottom: 3 },
  small: { fontSize: 8, color: PDF_COLORS.muted },
  title: { fontSize: 13, fontWeight: 600, textAlign: 'right', lineHeight: 1.2, marginBottom: 2 },
  label: { fontSize: 7.5, color: PDF_COLORS.muted, textTransform: 'uppercase', letterSpacing: 0.6, marginBottom: 2 },
  row: { flexDirection: 'row' },
  section: { marginBottom: 12 },
  th: { fontSize: 7.5, fontWeight: 600, color: PDF_COLORS.muted, paddingVertical: 4, paddingHorizontal: 4 },
  td: { paddingVertical: 5, paddingHorizontal: 4 },
  tableHead: { flexDirection: 'row', backgroundColor: PDF_COLORS.soft, borderBottomWidth: 1, borderBottomColor: PDF_COLORS.line },
  tableRow: { flexDirection: 'row', borderBottomWidth: 0.5, borderBottomColor: PDF_COLORS.line },
  num: { textAlign: 'right' },
  // The Plex Mono .woff does not parse in the PDF renderer; the built-in Courier stands in.
  mono: { fontFamily: 'Courier' },
  note: { borderLeftWidth: 3, borderLeftColor: PDF_COLORS.copper, backgroundColor: PDF_COLORS.soft, padding: 6, marginBottom: 8 },
  footer: { position: 'absolute', bottom: 20, left: 40, right: 40, flexDirection: 'row', justifyContent: 'space-between', fontSize: 7.5, color: PDF_COLORS.muted },
});

export function Labelled({ label, children, style }: { label: string; children: ReactNode; style?: ComponentProps<typeof View>['style'] }) {
  return (
    <View style={style}>
      <Text style={pdf.label}>{label}</Text>
      {typeof children === 'string' ? <Text>{children}</Text> : children}
    </View>
  );
}

export type ShopHeader = { name: string; address: string; phone: string; email: string };

export function ShopBlock({ shop }: { shop: ShopHeader | null }) {
  return (
    <View>
      <Text style={pdf.shopName}>{shop?.name ?? 'Our shop'}</Text>
      {shop ? <Text style={pdf.small}>{shop.address}</Text> : null}
      {shop ? <Text style={pdf.small}>{[shop.phone, shop.email].filter(Boolean).join('  ·  ')}</Text> : null}
    </View>
  );
}

export function PageFooter({ left }: { left: string }) {
  return (
    <View style={pdf.footer} fixed>
      <Text>{left}</Text>
      <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
    </View>
  );
}
