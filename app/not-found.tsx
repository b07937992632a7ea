import Link from 'next/link';

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="text-sm font-semibold tracking-wide text-copper-deep uppercase">404</p>
      <h1 className="mt-2 text-2xl font-semibold">Not found</h1>
      <p className="mt-3 text-ink-muted">There is nothing here, or it is not yours to see.</p>
      <Link href="/" className="mt-6 inline-block font-medium text-action underline">
        Go to your home page
      </Link>
    </main>
  );
}
