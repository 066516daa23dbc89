import {
  logOddsRatio,
  logOddsRatioToD,
  logRiskRatio,
  metaAnalysis,
  normalQuantile,
  smdFromMeans,
  smdFromT,
} from '@/lib/stats';
import { orientEffect, type Desirable } from '@/lib/scoring/direction';
import type { Appraisal, Mechanism, Study } from '@/models';
import type { Direction, EffectDataDTO, EffectMeasure, ForestRowDTO, MetaAnalysisDTO, PoolableDTO } from './types';

/**
 * Effect sizes and their pooling for the forest plot (docs/scoring.md §6).
 *
 * Two families, never pooled together:
 * - 'smd' — standardized mean differences. Means + SDs give Hedges' g with its variance;
 *   a t statistic gives d (t·√(1/n1 + 1/n2)) and the same Hedges correction (both Borenstein et
 *   al. 2009, ch. 4 and 7); a 2×2 table read as an odds ratio, or a ready log odds ratio, is
 *   converted to d with ×√3/π (Borenstein et al. 2009, ch. 7) so binary and continuous outcomes
 *   of the same question can be pooled; a ready SMD is taken as given.
 * - 'log-risk-ratio' — a 2×2 table read as a risk ratio, or a ready log risk ratio. A risk ratio
 *   has no accepted conversion to d, so it is pooled only with other risk ratios.
 *
 * Each target (a mechanism, or the claimed outcome) is pooled in one family: the one the caller
 * asks for, else the one with more studies (the SMD family on a tie); the other family's
 * appraisals are listed as excluded with the reason. Pooling uses inverse-variance fixed effect
 * and DerSimonian–Laird random effects (lib/stats metaAnalysis); the forest plot's weights are
 * the random-effects ones.
 */

export interface ComparableEffect {
  measure: EffectMeasure;
  effectSize: number;
  variance: number;
  /** True when the effect was moved to the pooled scale (log OR → d). */
  converted: boolean;
}

export function comparableEffect(effect: EffectDataDTO): ComparableEffect {
  switch (effect.kind) {
    case 'means': {
      const smd = smdFromMeans(effect);
      return { measure: 'smd', effectSize: smd.g, variance: smd.vg, converted: false };
    }
    case 't': {
      const smd = smdFromT(effect);
      return { measure: 'smd', effectSize: smd.g, variance: smd.vg, converted: false };
    }
    case 'two-by-two': {
      const table = { a: effect.a, b: effect.b, c: effect.c, d: effect.d };
      if (effect.measure === 'risk-ratio') {
        const rr = logRiskRatio(table);
        return { measure: 'log-risk-ratio', effectSize: rr.yi, variance: rr.vi, converted: false };
      }
      const or = logOddsRatio(table);
      const d = logOddsRatioToD(or.yi, or.vi);
      return { measure: 'smd', effectSize: d.d, variance: d.vd!, converted: true };
    }
    case 'ready': {
      if (effect.measure === 'log-odds-ratio') {
        const d = logOddsRatioToD(effect.effectSize, effect.variance);
        return { measure: 'smd', effectSize: d.d, variance: d.vd!, converted: true };
      }
      return { measure: effect.measure, effectSize: effect.effectSize, variance: effect.variance, converted: false };
    }
  }
}

export const MEASURE_LABEL: Record<EffectMeasure, string> = {
  smd: "Standardized mean difference (Hedges' g; odds ratios converted to d)",
  'log-risk-ratio': 'Log risk ratio',
};

interface Candidate {
  appraisal: Appraisal;
  study: Study;
  effect: ComparableEffect | null;
  problem: string | null;
}

function candidates(appraisals: Appraisal[], studies: Map<number, Study>): Candidate[] {
  return appraisals.flatMap((appraisal): Candidate[] => {
    const study = studies.get(appraisal.studyId);
    if (!study) return [];
    if (!study.effect)
      return [{ appraisal, study, effect: null, problem: 'The study has no effect data in the library.' }];
    try {
      return [{ appraisal, study, effect: comparableEffect(study.effect as EffectDataDTO), problem: null }];
    } catch (error) {
      // Stored effect data passed zod, so this is a value the statistics cannot use (e.g. both SDs 0).
      return [
        {
          appraisal,
          study,
          effect: null,
          problem: `The effect data cannot be used: ${error instanceof Error ? error.message : 'invalid'}.`,
        },
      ];
    }
  });
}

function chooseMeasure(list: Candidate[], asked?: EffectMeasure): EffectMeasure {
  if (asked) return asked;
  const smd = list.filter((c) => c.effect?.measure === 'smd').length;
  const rr = list.filter((c) => c.effect?.measure === 'log-risk-ratio').length;
  return rr > smd ? 'log-risk-ratio' : 'smd';
}

/** Targets with at least two compatible effect sizes, for the workbench to offer forest plots. */
export function poolableTargets(appraisals: Appraisal[], studies: Map<number, Study>): PoolableDTO[] {
  const byTarget = new Map<number | null, Candidate[]>();
  for (const c of candidates(appraisals, studies)) {
    const list = byTarget.get(c.appraisal.mechanismId) ?? [];
    list.push(c);
    byTarget.set(c.appraisal.mechanismId, list);
  }
  const out: PoolableDTO[] = [];
  for (const [mechanismId, list] of byTarget) {
    const measure = chooseMeasure(list);
    const k = list.filter((c) => c.effect?.measure === measure).length;
    if (k >= 2) out.push({ mechanismId, measure, k });
  }
  return out.sort((a, b) => (a.mechanismId ?? 0) - (b.mechanismId ?? 0));
}

/** Which way a target's measure is desirable: the mechanism's own, else the claimed outcome's. */
export function targetDesirable(mechanism: { desirable?: string } | null, outcomeDesirable?: string): Desirable {
  const value = mechanism ? mechanism.desirable : outcomeDesirable;
  return value === 'lower' ? 'lower' : 'higher';
}

export type MetaOutcome = { ok: true; result: MetaAnalysisDTO } | { ok: false; found: number; measure: EffectMeasure };

/** Pools the effect sizes of one target's appraisals. */
export function metaAnalyze(input: {
  mechanism: Mechanism | null;
  appraisals: Appraisal[];
  studies: Map<number, Study>;
  measure?: EffectMeasure;
  /** Which way the claimed outcome's measure is desirable; a mechanism carries its own. */
  outcomeDesirable?: Desirable;
}): MetaOutcome {
  const targetId = input.mechanism?.id ?? null;
  const desirable = targetDesirable(input.mechanism, input.outcomeDesirable);
  const list = candidates(
    input.appraisals.filter((a) => a.mechanismId === targetId),
    input.studies,
  );
  const measure = chooseMeasure(list, input.measure);
  const included = list.filter((c) => c.effect?.measure === measure);
  if (included.length < 2) return { ok: false, found: included.length, measure };

  // Oriented (docs/scoring.md §10): right of 0 is always the claimed benefit, so a pain score
  // that should fall is drawn and pooled with its sign flipped.
  const oriented = included.map((c) => orientEffect(c.effect!.effectSize, desirable));
  const effects = included.map((c, i) => ({ yi: oriented[i], vi: c.effect!.variance }));
  const fixed = metaAnalysis(effects, { method: 'fixed' });
  const random = metaAnalysis(effects, { method: 'DL' });
  const z = normalQuantile(0.975);
  const studies: ForestRowDTO[] = included.map((c, i) => {
    const se = Math.sqrt(c.effect!.variance);
    return {
      appraisalId: c.appraisal.id,
      studyId: c.study.id,
      citation: c.study.citation,
      direction: c.appraisal.direction as Direction,
      effectSize: oriented[i],
      variance: c.effect!.variance,
      ciLow: oriented[i] - z * se,
      ciHigh: oriented[i] + z * se,
      weight: random.weights[i],
      fixedWeight: fixed.weights[i],
      source: (c.study.effect as EffectDataDTO).kind,
      converted: c.effect!.converted,
    };
  });
  const excluded = list
    .filter((c) => !included.includes(c))
    .map((c) => ({
      appraisalId: c.appraisal.id,
      studyId: c.study.id,
      citation: c.study.citation,
      reason:
        c.problem ??
        `Its effect is a ${c.effect!.measure === 'smd' ? 'standardized mean difference' : 'risk ratio'}, which is not pooled with the ${measure === 'smd' ? 'standardized mean differences' : 'risk ratios'}.`,
    }));
  return {
    ok: true,
    result: {
      mechanismId: targetId,
      target: input.mechanism?.name ?? 'Claimed outcome',
      k: included.length,
      measure,
      measureLabel: MEASURE_LABEL[measure],
      desirable,
      studies,
      fixed,
      random,
      excluded,
    },
  };
}
