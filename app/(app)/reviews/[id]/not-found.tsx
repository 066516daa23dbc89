import { ReviewNotFound } from '@/components/review/ReviewNotFound';

export default function NotFound() {
  return (
    <ReviewNotFound title="This review was not found">
      It may have been deleted, the link may be mistyped, or it belongs to a team you are not part of.
    </ReviewNotFound>
  );
}
