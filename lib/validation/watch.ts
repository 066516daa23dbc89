import { z } from 'zod';
import { idParam } from '@/lib/validation/reviews';

/** The evidence watch's routes (docs/api/publishing.md, "Evidence watch"). */
export const watchParams = z.object({ teamId: idParam });
/** `?wait=1` answers when the run is over instead of at once (scripts and tests). */
export const watchRunQuery = z.object({ wait: z.enum(['0', '1']).optional() });
export const suggestionParams = z.object({ id: idParam });
