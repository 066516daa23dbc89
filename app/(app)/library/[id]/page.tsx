import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { cache } from 'react';
import { StudyDetail } from '@/components/library/StudyDetail';
import { toViewer } from '@/components/review/viewer';
import { requirePageActor } from '@/lib/auth/current';
import { decide } from '@/lib/auth/policy';
import { studyById, studyDetail } from '@/lib/library/studies';

type Props = { params: Promise<{ id: string }> };

/** The study when it exists and the signed-in person may read it; else 404. */
const load = cache(async (rawId: string) => {
  const id = Number(rawId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const actor = await requirePageActor(`/library/${rawId}`);
  const study = await studyById(id).catch(() => null);
  // Another team's study answers like a missing one.
  if (!study || decide(actor, 'study.read', { teamId: study.teamId }) !== 'allow') notFound();
  return { actor, study };
});

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  return { title: (await load((await params).id)).study.title };
}

// GET /library/:id — the study: APA reference, exports, details, PDF and its appraisals.
export default async function StudyPage({ params }: Props) {
  const { actor, study } = await load((await params).id);
  return <StudyDetail studyId={study.id} viewer={toViewer(actor)} fallback={await studyDetail(study, actor.userId)} />;
}
