import type { VerdictPageDTO } from '@/lib/publishing/types';
import { VerdictArticle } from './VerdictArticle';
import { VerdictHead } from './VerdictHead';
import { VerdictShell } from './VerdictShell';

/** /v/[slug] as both of its pages render it: the shared head, the frame and the latest version. */
export function LatestVerdictPage({ page, signedIn }: { page: VerdictPageDTO; signedIn: boolean }) {
  return (
    <VerdictShell signedIn={signedIn}>
      <VerdictHead page={page} />
      <VerdictArticle page={page} latest />
    </VerdictShell>
  );
}
