import { z } from 'zod';

/**
 * Ids are positive integers written as such. A path, query string or form field carries digits
 * only ("3", never "0x3", "3e0", "+3", " 3" or "03"); a JSON body carries a number (never "1",
 * true or [1]). Coercion used to turn all of those into 3 or 1, so `0x3` opened item 3.
 */
const MAX_ID = Number.MAX_SAFE_INTEGER;
const message = 'Must be a positive whole number.';

/** An id in a JSON body: a JSON number, a positive safe integer. */
export const idField = z
  .number({ error: message })
  .int({ error: message })
  .positive({ error: message })
  .max(MAX_ID, { error: message });

/** An id in a path, query string or form field: decimal digits without sign, space or leading zero. */
export const idParam = z.union(
  [
    idField,
    z
      .string()
      .regex(/^[1-9][0-9]{0,15}$/, { error: message })
      .transform(Number)
      .pipe(idField),
  ],
  { error: message },
);
