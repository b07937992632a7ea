// Shared by the families' workbench calculators. Pure.

/** A calculator value as a number; anything else is NaN, which the engine refuses with a field message. */
export function num(v: number | string | undefined): number {
  return typeof v === 'number' ? v : Number.NaN;
}
