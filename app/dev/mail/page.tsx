import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { connection } from 'next/server';
import { Logo } from '@/components/layout/Logo';
import { EmptyState } from '@/components/ui/EmptyState';
import { isProduction } from '@/lib/env';
import { readDropInbox } from '@/lib/mail/inbox';
import { MailCard } from '../_components/MailCard';

export const metadata: Metadata = { title: 'Development mail', robots: { index: false } };

// The local SMTP fake's inbox. Development only: in production this route does not exist.
export default async function DevMailPage() {
  if (isProduction()) notFound();
  await connection();
  const mails = await readDropInbox();
  return (
    <>
      <header className="border-line bg-paper border-b">
        <div className="max-w-shell px-gutter mx-auto flex flex-wrap items-center justify-between gap-3 py-3">
          <Logo />
          <p className="border-warning-100 bg-warning-50 text-warning-800 rounded-full border px-3 py-1 text-xs font-semibold">
            Development only
          </p>
        </div>
      </header>
      <main id="main" className="max-w-shell px-gutter mx-auto w-full flex-1 py-8">
        <h1 className="text-3xl font-semibold">Mail</h1>
        <p className="text-ink-muted mt-1">
          Everything the app sent to the local mail fake, newest first. Reload to see new mail.
        </p>
        <div className="mt-6 space-y-4">
          {mails.length === 0 ? (
            <EmptyState title="No mail yet">
              Invite someone from the Team page or ask for a password reset; the mail appears here.
            </EmptyState>
          ) : (
            mails.map((mail) => <MailCard key={mail.id} mail={mail} />)
          )}
        </div>
      </main>
    </>
  );
}
