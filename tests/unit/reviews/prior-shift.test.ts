import { describe, expect, it } from 'vitest';
import { priorShift } from '@/components/review/prior-shift';
import { logit } from '@/lib/scoring/mechanism';

describe('priorShift', () => {
  it('names the evidence and the dose penalty that move the probability away from the prior', () => {
    // prior 0.5 (log-odds 0), evidence +ln 4 ≈ 1.39, penalty 0.5 → log-odds 0.89
    expect(priorShift({ prior: 0.5, logOdds: Math.log(4) - 0.5, dosePenalty: 0.5, appraised: 1 })).toBe(
      'From your prior 50 %: the evidence raises it (+1.39 log-odds); the protocol’s dose falls short (−0.5).',
    );
  });
  it('says when nothing is appraised yet', () => {
    expect(priorShift({ prior: 0.3, logOdds: logit(0.3), dosePenalty: 0, appraised: 0 })).toBe(
      'From your prior 30 %: no appraised evidence yet.',
    );
  });
});
