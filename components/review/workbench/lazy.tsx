'use client';

import dynamic from 'next/dynamic';
import type { ComponentProps } from 'react';
import { Skeleton } from '@/components/ui/Skeleton';
import { WhenNear } from './WhenNear';

/**
 * The workbench's heavier parts, each in its own chunk, fetched the first time it is shown: the
 * three dialog forms (with the validation schemas and the study search they bring), the
 * meta-analysis with its forest plot, and the similar-reviews search; and the panels below the
 * mechanisms, fetched when the reader comes near them. The page's first load keeps only what
 * the first screen needs (docs/architecture.md, "The workbench's weight").
 */

function FormLoading() {
  return (
    <p role="status" className="text-ink-muted text-sm">
      Loading the form…
    </p>
  );
}

export const AppraisalForm = dynamic(
  () => import('@/components/appraisal/AppraisalForm').then((m) => m.AppraisalForm),
  {
    ssr: false,
    loading: FormLoading,
  },
);

export const MechanismForm = dynamic(() => import('../MechanismForm').then((m) => m.MechanismForm), {
  ssr: false,
  loading: FormLoading,
});

export const ClaimForm = dynamic(() => import('../ClaimForm').then((m) => m.ClaimForm), {
  ssr: false,
  loading: FormLoading,
});

export const MetaAnalysisPanel = dynamic(
  () => import('@/components/charts/MetaAnalysisPanel').then((m) => m.MetaAnalysisPanel),
  { ssr: false, loading: () => <Skeleton className="h-40 w-full" /> },
);

/**
 * About the height each panel below the mechanisms takes with the demo reviews on a desktop, so
 * that its placeholder and its loading state hold its place. The placeholder is drawn well
 * outside the viewport (WhenNear starts a screen early), so a difference moves nothing in view.
 */
const ROOM = { dose: 'h-80', recommendations: 'h-[36rem]', publish: 'h-48' } as const;

const SimilarReviewsChunk = dynamic(
  () => import('@/components/search/SimilarReviews').then((m) => m.SimilarReviews),
  // It shows nothing until a few words match, so nothing holds its place meanwhile.
  { ssr: false, loading: () => null },
);
export function SimilarReviews(props: ComponentProps<typeof SimilarReviewsChunk>) {
  return (
    <WhenNear room={null}>
      <SimilarReviewsChunk {...props} />
    </WhenNear>
  );
}

const DoseCheckChunk = dynamic(() => import('../DoseCheckPanel').then((m) => m.DoseCheckPanel), {
  ssr: false,
  loading: () => <Skeleton className={`${ROOM.dose} w-full`} />,
});
export function DoseCheckPanel(props: ComponentProps<typeof DoseCheckChunk>) {
  return (
    <WhenNear room={ROOM.dose}>
      <DoseCheckChunk {...props} />
    </WhenNear>
  );
}

const RecommendationsChunk = dynamic(() => import('../RecommendationsPanel').then((m) => m.RecommendationsPanel), {
  ssr: false,
  loading: () => <Skeleton className={`${ROOM.recommendations} w-full`} />,
});
export function RecommendationsPanel(props: ComponentProps<typeof RecommendationsChunk>) {
  return (
    <WhenNear room={ROOM.recommendations}>
      <RecommendationsChunk {...props} />
    </WhenNear>
  );
}

const PublishChunk = dynamic(() => import('@/components/publishing/PublishPanel').then((m) => m.PublishPanel), {
  ssr: false,
  loading: () => <Skeleton className={`${ROOM.publish} w-full`} />,
});
export function PublishPanel(props: ComponentProps<typeof PublishChunk>) {
  return (
    <WhenNear room={ROOM.publish}>
      <PublishChunk {...props} />
    </WhenNear>
  );
}
