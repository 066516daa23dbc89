import { NotFoundPanel } from '@/components/layout/NotFoundPanel';

export default function TeamNotFound() {
  return (
    <NotFoundPanel title="That team is not one of yours">
      <p>
        Either the link is wrong or you are not a member of that team (any more). Your teams are listed on the
        dashboard; a team owner can invite you again.
      </p>
    </NotFoundPanel>
  );
}
