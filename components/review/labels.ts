/**
 * The words the workbench shows for stored values. Stored values stay machine-stable
 * ('to-failure', 'percent-1rm'); people read these. One table per enum so a label is
 * changed in one place.
 */
import type {
  CertaintyLevel,
  Direction,
  Effort,
  LoadUnit,
  Magnitude,
  MechanismKind,
  ReviewStatus,
  StudyDesign,
  TrainingStatus,
  VerdictKey,
} from '@/lib/reviews/types';
import { VERDICT_LABEL } from '@/lib/scoring/constants';

export const LOAD_UNIT_LABEL: Record<LoadUnit, string> = {
  'percent-max': '% of the athlete’s maximum',
  'percent-1rm': '%1RM (one-repetition maximum)',
  'percent-mvc': '%MVC (maximal voluntary contraction)',
  'percent-bodyweight': '% of body weight',
  'kg-added': 'kg added to body weight',
};

/** What each unit needs to be converted to a fraction of maximum (docs/scoring.md §8). */
export const LOAD_UNIT_HELP: Record<LoadUnit, string> = {
  'percent-max': 'Already on the common scale: 100 % is the most the athlete can hold or lift.',
  'percent-1rm': 'Treated as a fraction of maximum directly (80 %1RM = 0.8).',
  'percent-mvc': 'Treated as a fraction of maximum directly (60 %MVC = 0.6).',
  'percent-bodyweight':
    'Needs a reference athlete: their body weight and the most load they can add, so the total can be compared with their maximum.',
  'kg-added':
    'Needs a reference athlete: body weight and maximum added load. A negative value means assistance (a pulley or feet on the floor).',
};

export const EFFORT_LABEL: Record<Effort, string> = {
  easy: 'Easy',
  moderate: 'Moderate',
  hard: 'Hard',
  'to-failure': 'To failure',
};

export const TRAINING_STATUS_LABEL: Record<TrainingStatus, string> = {
  untrained: 'Untrained',
  recreational: 'Recreational',
  trained: 'Trained',
  elite: 'Elite',
};

export const REVIEW_STATUS_LABEL: Record<ReviewStatus, string> = {
  draft: 'Draft',
  'in-review': 'In peer review',
  approved: 'Approved',
  published: 'Published',
  archived: 'Archived',
};

export const MAGNITUDE_LABEL: Record<Magnitude, string> = {
  none: 'None (0)',
  small: 'Small (d ≈ 0.2)',
  moderate: 'Moderate (d ≈ 0.5)',
  large: 'Large (d ≈ 0.8)',
};

export const MECHANISM_KIND_LABEL: Record<MechanismKind, string> = {
  physiological: 'Physiological',
  perceptual: 'Perceptual',
  skill: 'Skill and technique',
  'non-specific': 'Non-specific',
};

export const MECHANISM_KIND_HELP: Record<MechanismKind, string> = {
  physiological: 'Muscle growth, neural drive, tendon stiffness or size, connective-tissue remodelling',
  perceptual: 'Pain and threat, confidence',
  skill: 'Learning the movement, better technique',
  'non-specific': 'Sleep, nutrition, concurrent training, expectation',
};

export const DIRECTION_LABEL: Record<Direction, string> = {
  supports: 'Supports',
  against: 'Against',
  neutral: 'Neutral',
};

export const CERTAINTY_LABEL: Record<CertaintyLevel, string> = {
  high: 'High',
  moderate: 'Moderate',
  low: 'Low',
  'very-low': 'Very low',
};

export const DESIGN_LABEL: Record<StudyDesign, string> = {
  'meta-analysis': 'Meta-analysis',
  randomized: 'Randomized trial',
  'non-randomized': 'Non-randomized comparison',
  cohort: 'Cohort',
  'case-control': 'Case-control',
  'cross-sectional': 'Cross-sectional',
  'case-series': 'Case series',
  'case-report': 'Case report',
  'expert-opinion': 'Expert opinion',
  animal: 'Animal study',
  'in-vitro': 'In-vitro study',
};

/** The verdict words are the scoring engine's own (docs/scoring.md §5), never a second copy. */
export const VERDICT_KEY_LABEL: Record<VerdictKey, string> = VERDICT_LABEL;

/** A fraction 0…1 as a whole percentage for people ("72 %"); null shows a dash. */
export function percent(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${(value * 100).toFixed(digits)} %`;
}

/** Seconds as "12 min 30 s" or "2 h 5 min", for weekly time under load. */
export function duration(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return '—';
  const s = Math.round(seconds);
  if (s < 60) return `${s} s`;
  const minutes = Math.floor(s / 60);
  if (minutes < 60) return s % 60 ? `${minutes} min ${s % 60} s` : `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  return minutes % 60 ? `${hours} h ${minutes % 60} min` : `${hours} h`;
}

/** An ISO date as "3 Dec 2026, 14:05" in the reader's locale and time zone. */
export function dateTime(iso: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return date.toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });
}

export const options = <K extends string>(labels: Record<K, string>) =>
  (Object.keys(labels) as K[]).map((value) => ({ value, label: labels[value] }));
