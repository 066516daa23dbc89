import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthCard } from '@/components/auth/AuthCard';
import { safeNextPath } from '@/components/auth/next-path';
import { SignInForm } from '@/components/auth/SignInForm';
import { currentActor } from '@/lib/auth/current';

export const metadata: Metadata = { title: 'Sign in' };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const raw = (await searchParams).next;
  const next = typeof raw === 'string' ? safeNextPath(raw) : undefined;
  if (await currentActor()) redirect(next ?? '/dashboard');
  const signUpHref = next ? `/sign-up?next=${encodeURIComponent(next)}` : '/sign-up';
  return (
    <AuthCard
      title="Sign in"
      intro="Back to your team's claims, evidence and verdicts."
      footer={
        <p>
          New to Loadbearing?{' '}
          <Link href={signUpHref} className="prose-link font-semibold">
            Start a team
          </Link>
        </p>
      }
    >
      <SignInForm next={next} />
    </AuthCard>
  );
}
