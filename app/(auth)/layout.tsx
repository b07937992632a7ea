import type { ReactNode } from 'react';

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center px-4 py-12">
      <div className="mb-6 flex items-center gap-2 text-xl font-semibold tracking-tight">
        <span aria-hidden="true" className="inline-block h-6 w-6 rounded-sm bg-action ring-4 ring-copper-soft" />
        Ampwright
      </div>
      <div className="w-full max-w-sm rounded-lg border border-surface-line bg-surface p-6 shadow-sm">{children}</div>
      <p className="mt-6 max-w-sm text-center text-xs text-ink-faint">Quoting, bath control, lot quality and billing for the plating shop.</p>
    </main>
  );
}
