import type { PopulationDTO, ProtocolDTO } from '@/lib/reviews/types';
import type { LoadUnit } from '@/lib/reviews/types';
import { EFFORT_LABEL, percent, TRAINING_STATUS_LABEL } from './labels';

/**
 * The claim's protocol and population in one line each, as the workbench header and the
 * reviewer's scorecard both show them (one wording, one set of plurals).
 */

const LOAD_UNIT_SHORT: Record<LoadUnit, string> = {
  'percent-max': '% of max',
  'percent-1rm': '%1RM',
  'percent-mvc': '%MVC',
  'percent-bodyweight': '% body weight',
  'kg-added': 'kg added',
};

const count = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

/** "Pinch-block lift · 30 % of max · 10 s × 1 set × 4 sessions/day · 7 days/week · … · 3 weeks · effort easy" */
export function protocolSummary(p: ProtocolDTO): string {
  const parts: string[] = [];
  if (p.exercise) parts.push(p.exercise);
  if (p.loadValue !== null && p.loadUnit) parts.push(`${p.loadValue} ${LOAD_UNIT_SHORT[p.loadUnit]}`);
  // Body-weight loads only mean something next to the athlete's maximum: show the conversion.
  if (p.intensity !== null && (p.loadUnit === 'percent-bodyweight' || p.loadUnit === 'kg-added')) {
    parts.push(`≈ ${percent(p.intensity)} of max`);
  }
  const dose = [
    p.secondsPerSet !== null ? `${p.secondsPerSet} s` : null,
    p.setsPerSession !== null ? `× ${count(p.setsPerSession, 'set')}` : null,
    p.sessionsPerDay !== null ? `× ${count(p.sessionsPerDay, 'session')}/day` : null,
    p.daysPerWeek !== null ? `· ${count(p.daysPerWeek, 'day')}/week` : null,
  ]
    .filter(Boolean)
    .join(' ');
  if (dose) parts.push(dose);
  if (p.minHoursBetween !== null) parts.push(`≥ ${p.minHoursBetween} h apart`);
  if (p.weeks !== null) parts.push(count(p.weeks, 'week'));
  if (p.effort) parts.push(`effort ${EFFORT_LABEL[p.effort].toLowerCase()}`);
  return parts.join(' · ') || 'No protocol recorded';
}

/** "Recreational, healthy" */
export function populationSummary({ status, injured }: PopulationDTO): string {
  return `${status ? TRAINING_STATUS_LABEL[status] : 'Any training status'}, ${injured ? 'injured' : 'healthy'}`;
}
