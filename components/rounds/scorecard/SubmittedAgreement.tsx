'use client';

import { LocalTime } from '@/components/review/LocalTime';
import { useAgreement } from '@/lib/swr/use-rounds';
import { AgreementPanel } from '../AgreementPanel';

/** After submitting: the reviewer's scores beside the others' and the engine's. */
export function SubmittedAgreement({
  reviewId,
  roundId,
  submittedAt,
}: {
  reviewId: number;
  roundId: number;
  submittedAt: string;
}) {
  const { data, error } = useAgreement(reviewId, roundId);
  return (
    <section aria-labelledby="after-submit" className="space-y-4">
      <div className="border-success-100 bg-success-50 text-success-800 rounded-md border px-4 py-3" role="status">
        <h2 id="after-submit" className="text-base font-semibold">
          Submitted <LocalTime iso={submittedAt} />
        </h2>
        <p className="text-sm">Your scores are final. Here is how they compare with the others’ and with the engine.</p>
      </div>
      {error && (
        <p role="alert" className="text-danger-700 text-sm">
          The agreement could not be loaded: {error.message}
        </p>
      )}
      {data && <AgreementPanel agreement={data} />}
    </section>
  );
}
