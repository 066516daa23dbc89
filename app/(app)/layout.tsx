import { redirect } from 'next/navigation';
import { AppHeader } from '@/components/layout/AppHeader';
import { navFor } from '@/components/layout/nav';
import { findUser } from '@/lib/auth/accounts';
import { requirePageActor } from '@/lib/auth/current';

// Layouts do not know the requested path; the proxy already sent signed-out visitors to
// /sign-in with the right ?next=, so this only catches a session whose account is gone.
export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor('/dashboard');
  const user = await findUser(actor.userId);
  if (!user) redirect('/sign-in');
  return (
    <>
      <AppHeader user={{ name: user.name, email: user.email }} nav={navFor(actor)} />
      <main id="main" className="max-w-shell px-gutter mx-auto w-full flex-1 pt-8 pb-16">
        {children}
      </main>
    </>
  );
}
