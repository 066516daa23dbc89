import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';

export default function ReviewNotFound() {
  return (
    <EmptyState
      title="This review was not found"
      action={
        <LinkButton href="/reviews" variant="primary">
          See the team’s reviews
        </LinkButton>
      }
    >
      It may have been deleted, the link may be mistyped, or it belongs to a team you are not part of.
    </EmptyState>
  );
}
