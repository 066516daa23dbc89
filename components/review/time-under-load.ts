import { weeklyTimeUnderLoad } from '@/lib/training/dose';

/**
 * The week's time under load as soon as the protocol has seconds per set, sets per session and
 * sessions per day (days per week defaults to every day), or null while one is missing or out of
 * range. The same lib/training function the verdict route uses, so the two never differ.
 */
export function weeklySecondsFromProtocol(p: {
  secondsPerSet: number | null;
  setsPerSession: number | null;
  sessionsPerDay: number | null;
  daysPerWeek: number | null;
}): number | null {
  if (p.secondsPerSet === null || p.setsPerSession === null || p.sessionsPerDay === null) return null;
  try {
    return weeklyTimeUnderLoad({
      secondsPerSet: p.secondsPerSet,
      setsPerSession: p.setsPerSession,
      sessionsPerDay: p.sessionsPerDay,
      daysPerWeek: p.daysPerWeek ?? undefined,
    });
  } catch {
    return null;
  }
}

/** "1 session", "2 sessions". */
export const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
