'use client';

import dynamic from 'next/dynamic';
import { useMemo } from 'react';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import type { ScorecardViewDTO } from '@/lib/rounds/types';
import { useScorecardDraft } from '@/lib/swr/use-scorecard-draft';
import { ReviewBody } from './ReviewBody';
import { EvidenceList } from './scorecard/EvidenceList';
import { MechanismScoreCard } from './scorecard/MechanismScoreCard';
import { OverallCard } from './scorecard/OverallCard';
import { ScorecardHeader } from './scorecard/ScorecardHeader';
import { SubmittedAgreement } from './scorecard/SubmittedAgreement';

// The threads sit at the end of the page and fetch their own data: their code comes after.
const CommentThreads = dynamic(() => import('./CommentThreads').then((m) => m.CommentThreads), { ssr: false });

/**
 * The reviewer's scorecard: the review as the author wrote it (never the engine's output),
 * a likelihood band, a contribution and a comment per mechanism, an overall comment and a
 * sign-off. The draft saves itself a moment after each change; submitting is final.
 */
export function ScorecardPage({ view }: { view: ScorecardViewDTO }) {
  const { round, review, mechanisms, studies, appraisals } = view;
  const draft = useScorecardDraft(view);
  const { ratings, submittedAt, locked, errors } = draft;
  const studyById = useMemo(() => new Map(studies.map((s) => [s.id, s])), [studies]);
  const mechanismById = useMemo(() => new Map(mechanisms.map((m) => [m.id, m])), [mechanisms]);
  const outcomeAppraisals = appraisals.filter((a) => a.mechanismId === null);

  return (
    <div className="space-y-8">
      <ScorecardHeader round={round} review={review} submittedAt={submittedAt} />

      {submittedAt && <SubmittedAgreement reviewId={review.id} roundId={round.id} submittedAt={submittedAt} />}

      <Card aria-labelledby="analysis">
        <CardHeader id="analysis" title="The author’s analysis" />
        <CardBody>
          <ReviewBody
            body={review.body}
            mechanismName={(id) => mechanismById.get(id)?.name}
            citation={(id) => studyById.get(id)?.citation}
          />
        </CardBody>
      </Card>

      <section aria-labelledby="score-heading" className="space-y-4">
        <h2 id="score-heading" className="text-xl font-semibold">
          {locked ? 'Your scores' : 'Score each mechanism'}
        </h2>
        {mechanisms.length === 0 && <p className="text-ink-muted">This review has no mechanisms to score.</p>}
        {mechanisms.map((m, index) => (
          <MechanismScoreCard
            key={m.id}
            mechanism={m}
            index={index}
            rating={ratings.find((r) => r.mechanismId === m.id)!}
            evidence={appraisals.filter((a) => a.mechanismId === m.id)}
            studyById={studyById}
            errors={errors}
            locked={locked}
            onChange={(patch) => draft.change(m.id, patch)}
          />
        ))}
      </section>

      {outcomeAppraisals.length > 0 && (
        <Card aria-labelledby="outcome-evidence">
          <CardHeader id="outcome-evidence" title="Evidence on the claimed outcome itself" />
          <CardBody>
            <EvidenceList evidence={outcomeAppraisals} studyById={studyById} />
          </CardBody>
        </Card>
      )}

      <OverallCard draft={draft} />

      {(submittedAt || round.status === 'open') && (
        <CommentThreads
          reviewId={review.id}
          roundId={round.id}
          mechanisms={mechanisms.map((m) => ({ id: m.id, name: m.name }))}
          open={round.status === 'open'}
          canResolve={false}
        />
      )}
    </div>
  );
}
