// Recovery codes as made: once, in a grid the user can print or copy.
export function RecoveryCodes({ codes }: { codes: string[] }) {
  return (
    <div>
      <ul role="list" aria-label="Recovery codes" className="grid grid-cols-2 gap-x-4 gap-y-1 rounded-md border border-surface-line bg-surface-sunken p-3 font-mono text-sm">
        {codes.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ul>
      <p className="mt-2 text-xs text-ink-muted">Each code signs you in once if you lose your phone. Print them or keep them in a password manager.</p>
    </div>
  );
}
