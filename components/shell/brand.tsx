import Link from 'next/link';

export function Brand({ href, subtitle }: { href: string; subtitle?: string }) {
  return (
    <Link href={href} className="flex items-center gap-2 no-underline">
      <span aria-hidden="true" className="inline-block h-5 w-5 rounded-sm bg-action ring-4 ring-copper-soft" />
      <span className="text-base font-semibold tracking-tight text-ink">Ampwright</span>
      {subtitle ? <span className="truncate text-xs font-normal text-ink-muted">{subtitle}</span> : null}
    </Link>
  );
}
