import { ReviewNotFound } from '@/components/review/ReviewNotFound';

export default function ScorecardNotFound() {
  return (
    <ReviewNotFound title="This scorecard was not found">
      Scorecards open only to the reviewers invited to a round. The link may be mistyped, or the round belongs to a team
      you are not part of.
    </ReviewNotFound>
  );
}
