import { formatNumber } from '@/lib/scoring/format';
import { logit } from '@/lib/scoring/mechanism';
import { percent } from './labels';

/**
 * One short line on why a mechanism's probability differs from the prior the coach typed. The
 * engine's log-odds are the prior's log-odds + the evidence − the dose penalty (docs/scoring.md
 * §3), so the evidence's part is what remains once the other two are taken out.
 */
export function priorShift(input: { prior: number; logOdds: number; dosePenalty: number; appraised: number }): string {
  const evidence = input.logOdds + input.dosePenalty - logit(input.prior);
  const parts: string[] = [];
  if (input.appraised === 0) parts.push('no appraised evidence yet');
  else if (Math.abs(evidence) < 0.005) parts.push('the evidence is balanced');
  else
    parts.push(
      `the evidence ${evidence > 0 ? 'raises' : 'lowers'} it (${evidence > 0 ? '+' : '−'}${formatNumber(Math.abs(evidence), 2)} log-odds)`,
    );
  if (input.dosePenalty > 0) parts.push(`the protocol’s dose falls short (−${formatNumber(input.dosePenalty, 2)})`);
  return `From your prior ${percent(input.prior)}: ${parts.join('; ')}.`;
}
