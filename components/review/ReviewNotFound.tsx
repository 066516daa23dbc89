import type { ReactNode } from 'react';
import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';

/**
 * The not-found page of a review's segments (the workbench, its rounds, a scorecard): the title
 * says what was not found, the text why it may be so for that page, and the way back is the same.
 */
export function ReviewNotFound({ title, children }: { title: string; children: ReactNode }) {
  return (
    <EmptyState
      title={title}
      action={
        <LinkButton href="/reviews" variant="primary">
          See the team’s reviews
        </LinkButton>
      }
    >
      {children}
    </EmptyState>
  );
}
