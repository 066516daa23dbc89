import {
  CERTAINTY_LEVEL_BY_SCORE,
  CERTAINTY_SCORE_RANGE,
  DESIGN_START_SCORE,
  FORCED_INDIRECT_DESIGNS,
  LARGE_EFFECT_RR,
  STUDY_DESIGNS,
  UPGRADE_MAX_START,
} from './constants';
import {
  CERTAINTY_STEP_LABEL,
  CONCERN_INFO,
  CONCERN_LEVELS,
  DOMAIN_INFO,
  DOWNGRADE_DOMAINS,
  type GradingFields,
} from './appraisal-vocabulary';
import { ScoringInputError } from './errors';
import { optionalBoolean, requireFinite, requireObject, requireOneOf } from './validate';
import type { CertaintyLevel, Concern, StudyDesign } from './types';

/**
 * What the coach records about one study for one question (docs/scoring.md §1).
 *
 * @example
 * const input: CertaintyInput = { design: 'cohort', largeEffect: 1, doseResponse: true };
 */
export interface CertaintyInput extends Partial<GradingFields> {
  design: StudyDesign;
}

/**
 * Where a certainty step came from: the design's start, one of the five downgrade domains, one
 * of the three upgrades, or the final clamp to 1…4.
 *
 * @example
 * const domain: CertaintyDomain = 'imprecision';
 */
export type CertaintyDomain = keyof typeof CERTAINTY_STEP_LABEL;

/**
 * One line of the certainty working. For the first step (`design`) `change` is the starting
 * score itself; for the others it is the levels added or removed. `score` is the running total
 * after the step.
 *
 * @example
 * const step: CertaintyStep = {
 *   domain: 'riskOfBias', change: -1, score: 3,
 *   reason: 'Serious risk of bias rates certainty down one level.',
 * };
 */
export interface CertaintyStep {
  domain: CertaintyDomain;
  change: number;
  reason: string;
  score: number;
}

/**
 * The graded certainty of one appraisal.
 *
 * @example
 * const result: CertaintyResult = { level: 'high', score: 4, steps: [], notes: [] };
 */
export interface CertaintyResult {
  level: CertaintyLevel;
  score: 1 | 2 | 3 | 4;
  steps: CertaintyStep[];
  /** Upgrades the coach ticked that could not apply, and why — so a tick never vanishes silently. */
  notes: string[];
}

const DESIGN_WORDS: Record<StudyDesign, string> = {
  'meta-analysis': 'A meta-analysis',
  randomized: 'A randomized trial',
  'non-randomized': 'A non-randomized comparison',
  cohort: 'A cohort study',
  'case-control': 'A case-control study',
  'cross-sectional': 'A cross-sectional study',
  'case-series': 'A case series',
  'case-report': 'A case report',
  'expert-opinion': 'Expert opinion',
  animal: 'An animal study',
  'in-vitro': 'An in-vitro study',
};

const LEVEL_WORDS: Record<1 | 2 | 3 | 4, string> = {
  4: 'high',
  3: 'moderate',
  2: 'low',
  1: 'very low',
};

const levelsText = (n: number): string => (Math.abs(n) === 1 ? 'one level' : 'two levels');

/**
 * GRADE certainty of one appraisal, with every step of the working (docs/scoring.md §1).
 *
 * The design sets the start; each of the five domains rates down 0, 1 or 2 levels; only evidence
 * that starts at low or below and was not rated down can be rated up (large effect, dose-response
 * gradient, confounding that would shrink the effect); the score is clamped to 1…4. Animal and
 * in-vitro work start high but their indirectness counts as very serious at least, which the steps
 * show as a downgrade.
 *
 * @example
 * gradeCertainty({ design: 'randomized', riskOfBias: 'serious', imprecision: 'serious' });
 * // { level: 'low', score: 2, steps: [design +4, riskOfBias −1, imprecision −1], notes: [] }
 * gradeCertainty({ design: 'cohort', largeEffect: 2 }).level; // 'high'
 * gradeCertainty({ design: 'animal' }).level; // 'low'
 */
export function gradeCertainty(input: CertaintyInput): CertaintyResult {
  const raw = requireObject('certainty input', input);
  const design = requireOneOf('design', raw.design, STUDY_DESIGNS);
  const start = DESIGN_START_SCORE[design];
  let score: number = start;
  const steps: CertaintyStep[] = [
    {
      domain: 'design',
      change: start,
      score,
      reason: `${DESIGN_WORDS[design]} starts at ${LEVEL_WORDS[start]} (${start}).`,
    },
  ];
  const notes: string[] = [];

  let downgraded = false;
  const forcedIndirect = (FORCED_INDIRECT_DESIGNS as readonly string[]).includes(design);
  for (const domain of DOWNGRADE_DOMAINS) {
    const given: Concern = raw[domain] === undefined ? 'none' : requireOneOf(domain, raw[domain], CONCERN_LEVELS);
    const forced = domain === 'indirectness' && forcedIndirect && given !== 'very-serious';
    const concern: Concern = forced ? 'very-serious' : given;
    const change: number = CONCERN_INFO[concern].change;
    const reason = forced
      ? `${DESIGN_WORDS[design]} speaks to athletes only indirectly, so indirectness counts as ` +
        `very serious at least: down two levels.`
      : `${concern === 'serious' ? 'Serious' : 'Very serious'} ${DOMAIN_INFO[domain].label.toLowerCase()} rates ` +
        `certainty down ${levelsText(change)}.`;
    if (change !== 0) {
      downgraded = true;
      score += change;
      steps.push({ domain, change, score, reason });
    }
  }

  let largeEffect: 0 | 1 | 2 = 0;
  if (raw.largeEffect !== undefined) {
    if (raw.largeEffect !== 0 && raw.largeEffect !== 1 && raw.largeEffect !== 2) {
      throw new ScoringInputError('largeEffect', `must be 0, 1 or 2, got ${String(raw.largeEffect)}`);
    }
    largeEffect = raw.largeEffect;
  }
  const doseResponse = optionalBoolean('doseResponse', raw.doseResponse) ?? false;
  const confounding = optionalBoolean('confoundingWouldReduce', raw.confoundingWouldReduce) ?? false;

  const upgrades: { domain: CertaintyDomain; change: number; reason: string }[] = [];
  if (largeEffect > 0) {
    upgrades.push({
      domain: 'largeEffect',
      change: largeEffect,
      reason:
        largeEffect === 2
          ? 'A very large effect (risk ratio above 5 or below 0.2) rates certainty up two levels.'
          : 'A large effect (risk ratio above 2 or below 0.5) rates certainty up one level.',
    });
  }
  if (doseResponse) {
    upgrades.push({
      domain: 'doseResponse',
      change: 1,
      reason: 'A dose-response gradient rates certainty up one level.',
    });
  }
  if (confounding) {
    upgrades.push({
      domain: 'confoundingWouldReduce',
      change: 1,
      reason: 'Plausible confounding would have shrunk the effect: up one level.',
    });
  }
  if (upgrades.length > 0) {
    if (start > UPGRADE_MAX_START) {
      notes.push(
        `Upgrades were not applied: ${DESIGN_WORDS[design].toLowerCase()} starts at ` +
          `${LEVEL_WORDS[start]}, and only evidence starting at low or below is rated up.`,
      );
    } else if (downgraded) {
      notes.push('Upgrades were not applied: evidence that was rated down is not rated up.');
    } else {
      for (const upgrade of upgrades) {
        score += upgrade.change;
        steps.push({ ...upgrade, score });
      }
    }
  }

  const clamped = Math.min(CERTAINTY_SCORE_RANGE.max, Math.max(CERTAINTY_SCORE_RANGE.min, score));
  if (clamped !== score) {
    steps.push({
      domain: 'clamp',
      change: clamped - score,
      score: clamped,
      reason: `The score ${score} is outside 1…4, so it is held at ${clamped} (${LEVEL_WORDS[clamped as 1 | 2 | 3 | 4]}).`,
    });
  }
  const final = clamped as 1 | 2 | 3 | 4;
  return { level: CERTAINTY_LEVEL_BY_SCORE[final], score: final, steps, notes };
}

/**
 * The GRADE large-effect upgrade for a risk ratio: 2 when RR > 5 or < 0.2, 1 when RR > 2 or
 * < 0.5, otherwise 0. Edges (exactly 2, 0.5, 5, 0.2) do not qualify — GRADE says "above" and
 * "below".
 *
 * @example
 * largeEffectFromRiskRatio(3); // 1
 * largeEffectFromRiskRatio(0.15); // 2
 * largeEffectFromRiskRatio(2); // 0
 */
export function largeEffectFromRiskRatio(rr: number): 0 | 1 | 2 {
  requireFinite('riskRatio', rr, { min: 0, minExclusive: true });
  if (rr > LARGE_EFFECT_RR.veryLargeAbove || rr < LARGE_EFFECT_RR.veryLargeBelow) return 2;
  if (rr > LARGE_EFFECT_RR.largeAbove || rr < LARGE_EFFECT_RR.largeBelow) return 1;
  return 0;
}
