import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';

export default function ScorecardNotFound() {
  return (
    <EmptyState
      title="This scorecard was not found"
      action={
        <LinkButton href="/reviews" variant="primary">
          See the team’s reviews
        </LinkButton>
      }
    >
      Scorecards open only to the reviewers invited to a round. The link may be mistyped, or the round belongs to a team
      you are not part of.
    </EmptyState>
  );
}
