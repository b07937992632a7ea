import { LinkButton } from './button';

/**
 * Pages by key: a way back to the top once the reader has gone down ("Newest …"), and on to the
 * next page while there is more ("Older …"); lists in another order name their own ends.
 * `olderHref` is null on the last page.
 */
export function KeyPager({
  basePath,
  olderHref,
  onFirstPage,
  what,
  firstLabel = 'Newest',
  moreLabel = 'Older',
}: {
  basePath: string;
  olderHref: string | null;
  onFirstPage: boolean;
  what: string;
  firstLabel?: string;
  moreLabel?: string;
}) {
  if (onFirstPage && !olderHref) return null;
  return (
    <nav aria-label={`More ${what}`} className="flex flex-wrap items-center justify-between gap-3">
      {onFirstPage ? <span /> : <LinkButton variant="ghost" href={basePath}>{firstLabel} {what}</LinkButton>}
      {olderHref ? <LinkButton variant="secondary" href={olderHref}>{moreLabel} {what}</LinkButton> : null}
    </nav>
  );
}

/** Reads a cursor of two parts ("2026-11-30~I2026-00012") from a search parameter; null when absent or malformed. */
export function readCursor(value: string | string[] | undefined, first: RegExp, second: RegExp): [string, string] | null {
  if (typeof value !== 'string') return null;
  const [a, b, ...rest] = value.split('~');
  return a && b && rest.length === 0 && first.test(a) && second.test(b) ? [a, b] : null;
}
