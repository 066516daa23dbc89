import type { Metadata } from 'next';
import { StudyDetail } from '@/components/library/StudyDetail';
import { toViewer } from '@/components/review/viewer';
import { readableStudy } from '@/lib/auth/page-gates';
import { studyDetail } from '@/lib/library/studies';

type Props = { params: Promise<{ id: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: (await readableStudy((await params).id)).study.title };
}

// GET /library/:id — the study: APA reference, exports, details, PDF and its appraisals. The
// layout has already answered 404 when the study is missing or another team's.
export default async function StudyPage({ params }: Props) {
  const { actor, study } = await readableStudy((await params).id);
  return <StudyDetail studyId={study.id} viewer={toViewer(actor)} fallback={await studyDetail(study, actor.userId)} />;
}
