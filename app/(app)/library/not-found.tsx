import { LinkButton } from '@/components/ui/Button';
import { EmptyState } from '@/components/ui/EmptyState';

export default function StudyNotFound() {
  return (
    <EmptyState
      title="This study was not found"
      action={
        <LinkButton href="/library" variant="primary">
          Open the library
        </LinkButton>
      }
    >
      It may have been deleted from the library, or it belongs to a team you are not part of.
    </EmptyState>
  );
}
