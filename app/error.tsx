'use client';

import { ErrorPanel } from '@/components/layout/ErrorPanel';

export default function RootError({ error, retry }: { error: unknown; retry: () => void }) {
  return (
    <main id="main" className="px-gutter flex-1">
      <ErrorPanel error={error} retry={retry} home={{ href: '/', label: 'Go to the start page' }} />
    </main>
  );
}
