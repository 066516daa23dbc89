import { hangLoad } from '@/lib/training/dose';
import type { ProtocolDTO, PopulationDTO, VerdictKey } from '@/lib/reviews/types';
import type { EverydayProtocol, SnapshotMechanism } from './types';

/**
 * The words an athlete reads: the protocol in everyday terms and a one-paragraph summary of the
 * verdict. Pure functions of the snapshot's numbers, so a version always says the same thing.
 */

const round = (x: number, step = 0.5) => Math.round(x / step) * step;
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

const EFFORT_WORDS = {
  easy: 'easy: you could keep going for a long time',
  moderate: 'moderate: noticeably working, well short of your limit',
  hard: 'hard: close to your limit by the end of each set',
  'to-failure': 'to failure: each set ends when you cannot hold or lift any more',
} as const;

/** Body weights the load table shows: light, middling and heavy climbers and lifters. */
export const TABLE_BODYWEIGHTS = [55, 70, 85];

export function everydayProtocol(p: ProtocolDTO): EverydayProtocol {
  const lines: string[] = [];
  if (p.exercise) lines.push(`The exercise: ${p.exercise}.`);
  if (p.intensity !== null) {
    lines.push(`The load: about ${Math.round(p.intensity * 100)} % of the most you can manage in that exercise.`);
  }
  const set = [
    p.secondsPerSet !== null ? `${plural(p.secondsPerSet, 'second')} under load per set` : null,
    p.setsPerSession !== null ? plural(p.setsPerSession, 'set') + ' per session' : null,
  ].filter(Boolean);
  if (set.length) lines.push(`Each session: ${set.join(', ')}.`);
  const often = [
    p.sessionsPerDay !== null ? `${plural(p.sessionsPerDay, 'session')} a day` : null,
    p.daysPerWeek !== null ? `${plural(p.daysPerWeek, 'day')} a week` : null,
    p.minHoursBetween !== null && (p.sessionsPerDay ?? 1) > 1
      ? `at least ${plural(p.minHoursBetween, 'hour')} apart`
      : null,
  ].filter(Boolean);
  if (often.length) lines.push(`How often: ${often.join(', ')}.`);
  if (p.weeks !== null) lines.push(`For how long: ${plural(p.weeks, 'week')}.`);
  if (p.effort) lines.push(`How hard it should feel: ${EFFORT_WORDS[p.effort]}.`);

  let loadTable: EverydayProtocol['loadTable'] = null;
  let loadTableNote: string | null = null;
  const bodyweightBased = p.loadUnit === 'kg-added' || p.loadUnit === 'percent-bodyweight';
  if (bodyweightBased && p.intensity !== null && p.referenceBodyweightKg && p.referenceMaxAddedKg !== null) {
    // Scaled from the reference athlete: the same maximum relative to body weight (lib/training/dose hangLoad).
    const ratio = p.referenceMaxAddedKg / p.referenceBodyweightKg;
    loadTable = TABLE_BODYWEIGHTS.map((bw) => {
      const { total, added } = hangLoad({ bodyweight: bw, maxAddedLoad: bw * ratio, fraction: p.intensity! });
      return { bodyweightKg: bw, totalKg: round(total), addedKg: round(added) };
    });
    loadTableNote =
      `Worked out for someone whose best effort is body weight ${ratio >= 0 ? 'plus' : 'minus'} ` +
      `${Math.abs(Math.round(ratio * 100))} % (like the reference athlete: ${p.referenceBodyweightKg} kg, ` +
      `best ${p.referenceMaxAddedKg >= 0 ? '+' : '−'}${Math.abs(p.referenceMaxAddedKg)} kg). A negative “added” ` +
      'means taking weight off (a pulley or feet on the ground). Your own numbers depend on your own best effort: ask your coach.';
  }
  return { lines, loadTable, loadTableNote };
}

const POPULATION_WORDS: Record<string, string> = {
  untrained: 'people new to training',
  recreational: 'recreational athletes',
  trained: 'trained athletes',
  elite: 'elite athletes',
};

export function populationWords(population: PopulationDTO): string {
  const who = population.status ? POPULATION_WORDS[population.status] : 'the people it was aimed at';
  return population.injured ? `${who} who are injured` : who;
}

/** One paragraph, in the words of the likelihood scale the engine uses. */
export function verdictSummary(input: {
  key: VerdictKey;
  outcomeTerm: string;
  mechanisms: SnapshotMechanism[];
  population: PopulationDTO;
}): string {
  const { key, outcomeTerm, mechanisms } = input;
  const who = populationWords(input.population);
  const top = mechanisms[0];
  const stated = mechanisms.find((m) => m.stated);
  const topSentence = top ? ` The likeliest explanation of any effect is ${top.name.toLowerCase()} (${top.term}).` : '';
  switch (key) {
    case 'supported':
      return `The evidence backs this claim for ${who}: it is ${outcomeTerm} that the protocol delivers what it promises.${topSentence}`;
    case 'not-supported':
      return `The evidence does not back this claim for ${who}: it is ${outcomeTerm} that the protocol delivers what it promises.${topSentence}`;
    case 'uncertain':
      return `The evidence is split, so this claim is unsettled for ${who}: it is ${outcomeTerm} that the protocol delivers what it promises. Better studies could tip it either way.${topSentence}`;
    case 'insufficient':
      return `There is not enough good evidence to judge this claim for ${who} yet. Until there is, treat the promise as unproven.${topSentence}`;
    case 'other-reasons':
      return (
        `The protocol may help ${who}, but probably not for the reason its promoters give.` +
        (stated ? ` The mechanism they name, ${stated.name.toLowerCase()}, is ${stated.term}.` : '') +
        topSentence
      );
  }
}
