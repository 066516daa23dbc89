'use client';

import dynamic from 'next/dynamic';
import { Skeleton } from '@/components/ui/Skeleton';

/**
 * The workbench's heavier parts, each in its own chunk, fetched the first time it is shown: the
 * three dialog forms (with the validation schemas and the study search they bring), the
 * meta-analysis with its forest plot, and the similar-reviews search. The page's first load
 * keeps only what the first screen needs (docs/architecture.md, "The workbench's weight").
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

export const SimilarReviews = dynamic(
  () => import('@/components/search/SimilarReviews').then((m) => m.SimilarReviews),
  // It shows nothing until a few words match, so nothing holds its place meanwhile.
  { ssr: false, loading: () => null },
);

// Below the mechanisms on every screen size, so never part of the first view: the dose check,
// the recommendations (with their form) and publishing come after the page is interactive.
export const DoseCheckPanel = dynamic(() => import('../DoseCheckPanel').then((m) => m.DoseCheckPanel), {
  ssr: false,
  loading: () => <Skeleton className="h-48 w-full" />,
});

export const RecommendationsPanel = dynamic(
  () => import('../RecommendationsPanel').then((m) => m.RecommendationsPanel),
  { ssr: false, loading: () => <Skeleton className="h-72 w-full" /> },
);

export const PublishPanel = dynamic(() => import('@/components/publishing/PublishPanel').then((m) => m.PublishPanel), {
  ssr: false,
  loading: () => <Skeleton className="h-32 w-full" />,
});
