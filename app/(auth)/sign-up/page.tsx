import type { Metadata } from 'next';
import Link from 'next/link';
import { redirect } from 'next/navigation';
import { AuthCard } from '@/components/auth/AuthCard';
import { safeNextPath } from '@/components/auth/next-path';
import { SignUpForm } from '@/components/auth/SignUpForm';
import { currentActor } from '@/lib/auth/current';

export const metadata: Metadata = { title: 'Create account' };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const raw = (await searchParams).next;
  const next = typeof raw === 'string' ? safeNextPath(raw) : undefined;
  if (await currentActor()) redirect(next ?? '/dashboard');
  const signInHref = next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
  return (
    <AuthCard
      title="Start your team"
      intro="Create an account and a team. You become its owner and invite your coaches, reviewers and athletes."
      footer={
        <>
          <p>
            Already have an account?{' '}
            <Link href={signInHref} className="prose-link font-semibold">
              Sign in instead
            </Link>
          </p>
          <p>Joining someone else&apos;s team? Open the invitation link from your e-mail.</p>
        </>
      }
    >
      <SignUpForm next={next} />
    </AuthCard>
  );
}
