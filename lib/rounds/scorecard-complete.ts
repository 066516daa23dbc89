/**
 * What a scorecard still lacks before it can be submitted: every mechanism a likelihood band and
 * a contribution, the scorecard a sign-off. One rule for the server's refusal and for the page,
 * which checks before asking "you cannot change this afterwards".
 */
export function scorecardGaps(
  mechanisms: readonly { id: number; name: string }[],
  input: {
    ratings: readonly { mechanismId: number; band: number | null; contribution: string | null }[];
    signOff: string | null;
  },
): { path: string; message: string }[] {
  const byId = new Map(input.ratings.map((r) => [r.mechanismId, r]));
  const issues = mechanisms.flatMap((m) => {
    const r = byId.get(m.id);
    const out: { path: string; message: string }[] = [];
    if (r?.band === null || r?.band === undefined)
      out.push({ path: `mechanism.${m.id}.band`, message: `Rate the likelihood of “${m.name}”.` });
    if (!r?.contribution)
      out.push({ path: `mechanism.${m.id}.contribution`, message: `Choose the contribution of “${m.name}”.` });
    return out;
  });
  if (!input.signOff) issues.push({ path: 'signOff', message: 'Choose your sign-off.' });
  return issues;
}

export const INCOMPLETE_SCORECARD =
  'Complete the scorecard before submitting: every mechanism needs a likelihood and a contribution, and the scorecard a sign-off.';
