import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Card } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/empty-state';
import { FormMessage } from '@/components/ui/form-message';
import { PageHeader } from '@/components/ui/page-header';
import { requirePageUser } from '@/lib/auth/current-user';
import { fetchMailbox, isDemoMode } from '@/lib/email/mailbox';
import { formatDateTime } from '@/lib/quotes/format';

export const metadata: Metadata = { title: 'Demo mailbox' };
export const dynamic = 'force-dynamic';

// Links in the messages are shown as links so the demo can follow them.
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s]+)/g);
  return (
    <>
      {parts.map((p, i) =>
        /^https?:\/\//.test(p) ? (
          <a key={i} href={p} className="break-all text-action underline">
            {p}
          </a>
        ) : (
          <span key={i}>{p}</span>
        ),
      )}
    </>
  );
}

export default async function MailboxPage() {
  await requirePageUser('mailbox.read', '/settings/mailbox');
  if (!isDemoMode()) notFound();
  const { messages, error } = await fetchMailbox();
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Demo mailbox"
        description="Every e-mail the app sent in this demo, as the local mail server received it. Nothing leaves this machine."
      />
      {error ? <FormMessage tone="error" message={error} /> : null}
      {messages.length === 0 && !error ? <EmptyState title="No messages yet" description="Invite a user or ask for a password reset, and the message appears here." /> : null}
      <ol className="flex flex-col gap-4">
        {messages.map((m) => (
          <li key={m.id}>
            <Card title={m.subject} description={`To ${m.to.join(', ')} · ${formatDateTime(m.date)}`}>
              <pre className="font-sans text-sm whitespace-pre-wrap">
                <Linkified text={m.text} />
              </pre>
              {m.attachments.length ? (
                <p className="mt-2 text-xs text-ink-muted">Attachments: {m.attachments.map((a) => a.filename).join(', ')}</p>
              ) : null}
            </Card>
          </li>
        ))}
      </ol>
    </div>
  );
}
