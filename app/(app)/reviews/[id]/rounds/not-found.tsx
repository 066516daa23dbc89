import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';

export default function RoundsNotFound() {
  return (
    <EmptyState
      title="This review was not found"
      action={
        <LinkButton href="/reviews" variant="primary">
          See the team’s reviews
        </LinkButton>
      }
    >
      Peer review is run by the review’s author and the team owner. The link may be mistyped, or the review belongs to a
      team you are not part of.
    </EmptyState>
  );
}
