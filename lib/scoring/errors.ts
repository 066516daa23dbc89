/**
 * The one error the scoring model throws for input it cannot score.
 *
 * A verdict built on a silent NaN is worse than no verdict, so every function of lib/scoring,
 * lib/stats and lib/training refuses bad input loudly. `field` names the offending input (a
 * dotted path such as `mechanisms[2].evidence[0].certainty`) so a route handler can turn it into
 * a 400 issue without parsing the message.
 *
 * @example
 * try {
 *   likelihoodTerm(1.2);
 * } catch (error) {
 *   if (error instanceof ScoringInputError) console.log(error.field, error.message);
 * }
 */
export class ScoringInputError extends Error {
  /** Dotted path of the input that was rejected. */
  readonly field: string;

  constructor(field: string, message: string) {
    super(`${field}: ${message}`);
    this.name = 'ScoringInputError';
    this.field = field;
  }
}
