'use client';

import { ErrorPanel } from '@/components/layout/ErrorPanel';

export default function ReviewsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} home={{ href: '/dashboard', label: 'Back to dashboard' }} />;
}
