import { ReviewNotFound } from '@/components/review/ReviewNotFound';

export default function RoundsNotFound() {
  return (
    <ReviewNotFound title="This review was not found">
      Peer review is run by the review’s author and the team owner. The link may be mistyped, or the review belongs to a
      team you are not part of.
    </ReviewNotFound>
  );
}
