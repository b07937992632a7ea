'use client';

// Unexpected failures land here: a plain message and a way to try again, never a stack trace.
export default function ErrorPage({ reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1 className="text-2xl font-semibold">Something went wrong</h1>
      <p className="mt-3 text-ink-muted">
        The page could not be shown. If the database or the network is down, nothing was saved. Please try again in a moment.
      </p>
      <button type="button" onClick={reset} className="mt-6 min-h-10 rounded-md bg-action px-4 font-medium text-white hover:bg-action-hover">
        Try again
      </button>
    </main>
  );
}
