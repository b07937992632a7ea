import { DATABASE_UNAVAILABLE_MESSAGE } from '@/lib/errors';

export function DatabaseUnavailable() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center" role="alert">
      <p className="text-sm font-semibold tracking-wide text-copper-deep uppercase">503</p>
      <h1 className="mt-2 text-2xl font-semibold">Database unavailable</h1>
      <p className="mt-3 text-ink-muted">{DATABASE_UNAVAILABLE_MESSAGE}</p>
    </main>
  );
}
