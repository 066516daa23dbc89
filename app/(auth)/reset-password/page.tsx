import type { Metadata } from 'next';
import Link from 'next/link';
import { AuthCard } from '@/components/auth/AuthCard';
import { ResetConfirmForm } from '@/components/auth/ResetConfirmForm';
import { ResetRequestForm } from '@/components/auth/ResetRequestForm';

export const metadata: Metadata = { title: 'Reset password' };

// One address for both steps: the e-mailed link comes back here with ?token=.
export default async function ResetPasswordPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[] }>;
}) {
  const { token } = await searchParams;
  const footer = (
    <p>
      Remembered it?{' '}
      <Link href="/sign-in" className="prose-link font-semibold">
        Back to sign in
      </Link>
    </p>
  );
  if (typeof token === 'string' && token) {
    return (
      <AuthCard title="Choose a new password" intro="The link works once and for one hour." footer={footer}>
        <ResetConfirmForm token={token} />
      </AuthCard>
    );
  }
  return (
    <AuthCard title="Reset your password" intro="Enter the address you sign in with." footer={footer}>
      <ResetRequestForm />
    </AuthCard>
  );
}
