'use client';

import { ErrorPanel } from '@/components/layout/ErrorPanel';

export default function StudyError({ error, retry }: { error: unknown; retry: () => void }) {
  return <ErrorPanel error={error} retry={retry} home={{ href: '/library', label: 'Back to the library' }} />;
}
