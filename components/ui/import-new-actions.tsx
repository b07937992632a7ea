import { LinkButton } from './button';

/** A record list's two ways in: import a CSV file at `<base>/import`, or add one record at `<base>/new`. */
export function ImportNewActions({ base, newLabel }: { base: string; newLabel: string }) {
  return (
    <>
      <LinkButton href={`${base}/import`} variant="secondary">
        Import from CSV
      </LinkButton>
      <LinkButton href={`${base}/new`}>{newLabel}</LinkButton>
    </>
  );
}
