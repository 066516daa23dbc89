import type { ReviewDTO } from '@/lib/reviews/types';
import { apiFetch } from '@/lib/swr/fetcher';

/**
 * Every PATCH of one review goes through one saver, one at a time, each carrying the version
 * the last successful save returned. Two saves in flight with the same version would make our
 * own second save look like someone else's change (a false 409); the queue prevents that.
 *
 * The version only moves forward on our own successful save or when the coach chooses to
 * reload someone else's version — never silently from a background refresh, which would let
 * us overwrite a colleague's change without noticing.
 */
export class ReviewSaver {
  private queue: Promise<unknown> = Promise.resolve();

  constructor(
    readonly reviewId: number,
    public version: number,
  ) {}

  /** Take over someone else's version after the coach chose to load it (the conflict flow). */
  adopt(version: number): void {
    this.version = version;
  }

  patch(fields: Record<string, unknown>, { keepalive = false }: { keepalive?: boolean } = {}): Promise<ReviewDTO> {
    const run = async () => {
      const { review } = await apiFetch<{ review: ReviewDTO }>(`/api/reviews/${this.reviewId}`, {
        method: 'PATCH',
        json: { ...fields, version: this.version },
        keepalive,
      });
      this.version = review.version;
      return review;
    };
    const result = this.queue.then(run, run);
    this.queue = result.catch(() => undefined);
    return result;
  }
}
