import type { Metadata } from 'next';
import Link from 'next/link';
import { AuthCard } from '@/components/auth/AuthCard';
import { ConfirmSignUpForm } from '@/components/auth/ConfirmSignUpForm';
import { LinkButton } from '@/components/ui/Button';
import { signUpLinkState } from '@/lib/auth/sign-up';

export const metadata: Metadata = { title: 'Confirm your account' };

// GET /sign-up/confirm?token= — opening the mailed link only shows it; the button creates the
// account (a mail scanner that follows links creates nothing).
export default async function ConfirmSignUpPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[] }>;
}) {
  const { token } = await searchParams;
  const link =
    typeof token === 'string' && token.length >= 10 ? await signUpLinkState(token) : { state: 'unknown' as const };
  const signIn = (
    <p>
      Already have an account?{' '}
      <Link href="/sign-in" className="prose-link font-semibold">
        Sign in
      </Link>
    </p>
  );
  if (link.state === 'ready') {
    return (
      <AuthCard
        title="Create your account"
        intro={
          <>
            {link.name}, one click creates your account for <strong className="break-all">{link.email}</strong> and the
            team <strong>{link.teamName}</strong>, with you as its owner.
          </>
        }
        footer={signIn}
      >
        <ConfirmSignUpForm token={token as string} />
      </AuthCard>
    );
  }
  const problem = {
    used: {
      title: 'This link was already used',
      text: 'Your account exists. Sign in with your e-mail and password; if you have forgotten the password, reset it.',
      action: { href: '/sign-in', label: 'Go to sign in' },
    },
    expired: {
      title: 'This link has expired',
      text: 'Sign-up links work for 24 hours. Sign up again and we send you a new one.',
      action: { href: '/sign-up', label: 'Sign up again' },
    },
    unknown: {
      title: 'This link is not valid',
      text: 'It may be cut short: copy the whole link from the mail into the address bar, or sign up again.',
      action: { href: '/sign-up', label: 'Sign up again' },
    },
  }[link.state];
  return (
    <AuthCard title={problem.title} footer={link.state === 'used' ? undefined : signIn}>
      <div className="space-y-5">
        <p role="alert">{problem.text}</p>
        <LinkButton href={problem.action.href} variant="primary" className="w-full">
          {problem.action.label}
        </LinkButton>
      </div>
    </AuthCard>
  );
}
