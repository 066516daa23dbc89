import type { Metadata } from 'next';
import { ChangePasswordForm } from '@/components/account/ChangePasswordForm';
import { PageHeader } from '@/components/layout/PageHeader';
import { findUser } from '@/lib/auth/accounts';
import { requirePageActor } from '@/lib/auth/current';

export const metadata: Metadata = { title: 'Your account' };

// GET /account — who is signed in, and changing the password.
export default async function AccountPage() {
  const actor = await requirePageActor('/account');
  const user = await findUser(actor.userId);
  return (
    <>
      <PageHeader
        title="Your account"
        description={
          user && (
            <>
              Signed in as {user.name} ({user.email}).
            </>
          )
        }
      />
      <section
        aria-labelledby="password-heading"
        className="border-line bg-paper-raised max-w-form rounded-xl border px-5 py-6 sm:px-7"
      >
        <h2 id="password-heading" className="text-xl font-semibold">
          Change your password
        </h2>
        <p className="text-ink-muted mt-1 text-sm">
          You stay signed in here; every other device and browser where you are signed in is signed out.
        </p>
        <div className="mt-5">
          <ChangePasswordForm />
        </div>
      </section>
    </>
  );
}
