import Link from 'next/link';
import { signOutAction } from '@/lib/auth/actions';
import { ROLE_LABELS } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/auth/current-user';

/** The signed-in user and sign-out: stacked at the foot of the side column, on one line in a top bar. */
export function UserMenu({ user, accountHref, inline = false }: { user: SessionUser; accountHref: string; inline?: boolean }) {
  return (
    <div
      className={
        inline
          ? 'flex flex-wrap items-center gap-x-3 gap-y-1 border-t border-surface-line px-3 py-3 text-sm md:border-t-0 md:p-0'
          : 'flex flex-col gap-1 border-t border-surface-line px-3 py-3 text-sm'
      }
    >
      <Link href={accountHref} className="font-medium text-ink no-underline hover:underline">
        {user.name}
      </Link>
      <span className="text-xs text-ink-muted">{ROLE_LABELS[user.role]}</span>
      <form action={signOutAction}>
        <button type="submit" className={inline ? 'min-h-8 text-left text-sm text-action underline' : 'mt-1 min-h-8 text-left text-sm text-action underline'}>
          Sign out
        </button>
      </form>
    </div>
  );
}
