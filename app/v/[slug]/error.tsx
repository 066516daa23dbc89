'use client';

import { ErrorPanel } from '@/components/layout/ErrorPanel';

export default function VerdictError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} home={{ href: '/', label: 'Start page' }} />;
}
