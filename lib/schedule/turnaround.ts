// How a quote states its turnaround (working days from the parts' arrival to shipping).

export function turnaroundText(days: number | null | undefined): string | null {
  if (days === null || days === undefined) return null;
  return `Turnaround ${days} working ${days === 1 ? 'day' : 'days'} from receipt of parts, at the line's load when quoted`;
}
