import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { mono, sans } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Ampwright', template: '%s · Ampwright' },
  description: 'Quoting, bath control, lot quality and billing for electroplating job shops.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#0f5e63' };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${mono.variable}`}>
      <body className="min-h-screen bg-surface-muted font-sans text-ink antialiased">{children}</body>
    </html>
  );
}
