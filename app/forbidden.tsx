import Link from 'next/link';

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-6 py-24 text-center">
      <p className="text-sm font-semibold tracking-wide text-copper-deep uppercase">403</p>
      <h1 className="mt-2 text-2xl font-semibold">Not allowed</h1>
      <p className="mt-3 text-ink-muted">Your account does not have access to this page. If you think it should, ask the shop owner.</p>
      <Link href="/" className="mt-6 inline-block font-medium text-action underline">
        Go to your home page
      </Link>
    </main>
  );
}
