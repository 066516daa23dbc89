'use client';

import { ErrorPanel } from '@/components/layout/ErrorPanel';

export default function RoundsError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} home={{ href: '/reviews', label: 'Back to reviews' }} />;
}
