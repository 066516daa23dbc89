import { DEFAULT_PRIOR, robustness } from '@/lib/scoring';
import type { AnyReviewData, ScoredReview } from './verdict';
import type { RobustnessDTO } from './types';

/**
 * What a review's verdict hangs on (docs/scoring.md §9), in the rows' terms: lib/scoring's
 * robustness() works on the engine's input, where a study is its id as a string and a mechanism
 * its name; this maps both back to rows and adds each study's citation.
 */
export function robustnessFromScored(data: AnyReviewData, scored: ScoredReview): RobustnessDTO {
  const result = robustness(scored.input);
  const studyIdOf = (key: string) => Number(key);
  const citationOf = (studyId: number) => data.studies.get(studyId)?.citation ?? `Study ${studyId}`;
  const appraisals = new Map(data.appraisals.map((a) => [a.id, a]));

  // certaintyShifts come in the engine's reading order, which scoreReviewData recorded.
  const decidingCertainty = result.certaintyShifts.flatMap((shift, k) => {
    if (shift.down === result.verdict && shift.up === result.verdict) return [];
    const appraisal = appraisals.get(scored.appraisalOrder[k])!;
    return [
      {
        appraisalId: appraisal.id,
        studyId: appraisal.studyId,
        citation: citationOf(appraisal.studyId),
        mechanismId: appraisal.mechanismId,
        certainty: scored.derived.get(appraisal.id)!.certainty.level,
        down: shift.down,
        up: shift.up,
      },
    ];
  });

  return {
    fragility: result.fragility,
    fragileSet: result.fragileSet?.map(studyIdOf) ?? null,
    leaveOneOut: result.leaveOneOut.map((row) => ({
      studyId: studyIdOf(row.studyId),
      citation: citationOf(studyIdOf(row.studyId)),
      verdict: row.verdict,
      outcomeProbability: row.outcomeProbability,
      changed: row.changed,
    })),
    pivotal: result.pivotal.map(studyIdOf),
    // The outcome has no prior of its own in a review: the engine's default.
    outcomePrior: { prior: scored.input.outcome.prior ?? DEFAULT_PRIOR, ...result.outcomePriorRange },
    mechanismPriors: data.mechanisms.map((m, i) => ({
      mechanismId: m.id,
      prior: m.prior,
      low: result.mechanismPriorRanges[i].low,
      high: result.mechanismPriorRanges[i].high,
    })),
    decidingCertainty,
  };
}
