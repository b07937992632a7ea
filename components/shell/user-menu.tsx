import Link from 'next/link';
import { signOutAction } from '@/lib/auth/actions';
import { ROLE_LABELS } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/auth/current-user';

export function UserMenu({ user, accountHref }: { user: SessionUser; accountHref: string }) {
  return (
    <div className="flex flex-col gap-1 border-t border-surface-line px-3 py-3 text-sm">
      <Link href={accountHref} className="font-medium text-ink no-underline hover:underline">
        {user.name}
      </Link>
      <span className="text-xs text-ink-muted">{ROLE_LABELS[user.role]}</span>
      <form action={signOutAction}>
        <button type="submit" className="mt-1 min-h-8 text-left text-sm text-action underline">
          Sign out
        </button>
      </form>
    </div>
  );
}
