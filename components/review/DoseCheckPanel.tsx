'use client';

import { cn } from '@/components/ui/cn';
import { Skeleton } from '@/components/ui/Skeleton';
import type { MechanismDTO, ProtocolDTO } from '@/lib/reviews/types';
import { EFFORT_SCALE } from '@/lib/scoring/constants';
import { formatNumber } from '@/lib/scoring/format';
import type { VerdictDTO } from '@/lib/reviews/types';
import { duration, EFFORT_LABEL, percent } from './labels';
import { plural, weeklySecondsFromProtocol } from './time-under-load';

type Check = 'meets' | 'short' | 'no-minimum' | 'unknown';

function Verdict({ check, children }: { check: Check; children: React.ReactNode }) {
  const mark = { meets: '✓', short: '✗', 'no-minimum': '–', unknown: '?' }[check];
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1.5',
        check === 'meets' && 'text-success-700',
        check === 'short' && 'text-danger-700 font-semibold',
        (check === 'no-minimum' || check === 'unknown') && 'text-ink-muted',
      )}
    >
      <span aria-hidden="true">{mark}</span>
      {children}
    </span>
  );
}

/**
 * Does the protocol deliver the stimulus each mechanism needs? Intensity and effort against each
 * mechanism's minimum, with the dose penalty the engine applied; then the week's time under load
 * and whether the sessions fit the minimum rest between them. A shortfall here is the usual
 * reason a viral protocol "works, but not for the stated reason".
 */
export function DoseCheckPanel({
  protocol,
  mechanisms,
  verdict,
}: {
  protocol: ProtocolDTO;
  mechanisms: readonly MechanismDTO[];
  verdict: VerdictDTO | undefined;
}) {
  const dose = verdict?.dose;
  const intensity = dose?.protocolIntensity ?? protocol.intensity;
  const effort = dose?.protocolEffort ?? protocol.effort;
  // The shortfalls and penalties are the engine's (the verdict route runs lib/scoring); before
  // the verdict arrives, a plain comparison keeps the table from flashing empty.
  const checks = new Map((dose?.perMechanism ?? []).map((c) => [c.id, c]));

  const intensityCheck = (m: MechanismDTO): Check => {
    if (m.minIntensity == null) return 'no-minimum';
    if (intensity == null) return 'unknown';
    const engine = checks.get(m.id);
    if (engine) return engine.intensityShortfall > 0 ? 'short' : 'meets';
    return intensity >= m.minIntensity ? 'meets' : 'short';
  };
  const effortCheck = (m: MechanismDTO): Check => {
    if (m.minEffort == null) return 'no-minimum';
    if (effort == null) return 'unknown';
    const engine = checks.get(m.id);
    if (engine) return engine.effortShortfall > 0 ? 'short' : 'meets';
    return EFFORT_SCALE[effort] >= EFFORT_SCALE[m.minEffort] ? 'meets' : 'short';
  };

  return (
    <section aria-labelledby="dose-title" className="border-line bg-paper-raised shadow-card rounded-lg border">
      <div className="border-line border-b px-5 py-3">
        <h2 id="dose-title" className="text-lg font-semibold">
          Dose check
        </h2>
        <p className="text-ink-muted text-sm">
          The protocol runs at{' '}
          <strong className="text-ink">
            {intensity == null ? 'an unknown intensity' : `${percent(intensity)} of maximum`}
          </strong>
          , effort <strong className="text-ink">{effort ? EFFORT_LABEL[effort].toLowerCase() : 'not recorded'}</strong>.
        </p>
        {dose?.intensityExplanation && <p className="text-ink-muted text-xs">{dose.intensityExplanation}</p>}
      </div>
      <div className="space-y-5 px-5 py-4">
        {mechanisms.length === 0 ? (
          <p className="text-ink-muted text-sm">
            Add mechanisms to check whether the protocol reaches the stimulus each one needs.
          </p>
        ) : (
          <div className="relative -mx-5 overflow-x-auto px-5">
            <table className="w-full min-w-[34rem] text-sm" data-testid="dose-table">
              <caption className="sr-only">Protocol dose against each mechanism’s minimum</caption>
              <thead>
                <tr className="border-line-strong text-ink-muted border-b text-left text-xs tracking-wide uppercase">
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Mechanism
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Intensity needed
                  </th>
                  <th scope="col" className="py-2 pr-3 font-semibold">
                    Effort needed
                  </th>
                  <th scope="col" className="py-2 text-right font-semibold">
                    Dose penalty
                  </th>
                </tr>
              </thead>
              <tbody>
                {mechanisms.map((m) => {
                  const check = checks.get(m.id);
                  const penalty = check?.dosePenalty;
                  const ic = intensityCheck(m);
                  const ec = effortCheck(m);
                  return (
                    <tr key={m.id} className="border-line border-b align-top last:border-b-0" data-testid="dose-row">
                      <th scope="row" className="py-2.5 pr-3 text-left font-semibold">
                        {m.name}
                      </th>
                      <td className="py-2.5 pr-3">
                        <Verdict check={ic}>
                          {m.minIntensity == null
                            ? 'no minimum'
                            : `≥ ${percent(m.minIntensity)}${
                                ic === 'short'
                                  ? ` — short by ${percent(check?.intensityShortfall ?? 0)}`
                                  : ic === 'unknown'
                                    ? ' — protocol unknown'
                                    : ''
                              }`}
                        </Verdict>
                      </td>
                      <td className="py-2.5 pr-3">
                        <Verdict check={ec}>
                          {m.minEffort == null
                            ? 'no minimum'
                            : `${EFFORT_LABEL[m.minEffort]}${ec === 'short' ? ' — falls short' : ec === 'unknown' ? ' — protocol unknown' : ''}`}
                        </Verdict>
                      </td>
                      <td className="py-2.5 text-right tabular-nums">
                        {penalty === undefined ? (
                          verdict ? (
                            '—'
                          ) : (
                            <Skeleton className="ml-auto h-4 w-10" />
                          )
                        ) : penalty > 0 ? (
                          <span title="Subtracted from the mechanism’s log-odds">
                            −{formatNumber(penalty, 2)} log-odds
                          </span>
                        ) : (
                          'none'
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        )}

        <dl className="grid gap-4 sm:grid-cols-2">
          <div className="bg-paper-sunken/70 rounded-md px-4 py-3">
            <dt className="text-ink-muted text-sm">Time under load per week</dt>
            <dd className="text-lg font-semibold tabular-nums" data-testid="weekly-time-under-load">
              {dose ? duration(dose.weeklySecondsUnderLoad) : duration(weeklySecondsFromProtocol(protocol))}
            </dd>
            <dd className="text-ink-muted text-xs">
              {protocol.secondsPerSet ?? '?'} s × {protocol.setsPerSession ?? '?'} sets ×{' '}
              {protocol.sessionsPerDay === null ? '? sessions' : plural(protocol.sessionsPerDay, 'session')} ×{' '}
              {plural(protocol.daysPerWeek ?? 7, 'day')}
            </dd>
          </div>
          <div className="bg-paper-sunken/70 rounded-md px-4 py-3">
            <dt className="text-ink-muted text-sm">Spacing of sessions</dt>
            <dd className="text-lg font-semibold" data-testid="session-spacing">
              {!dose?.spacing ? (
                '—'
              ) : dose.spacing.ok ? (
                <Verdict check="meets">Fits in a day</Verdict>
              ) : (
                <Verdict check="short">Does not fit</Verdict>
              )}
            </dd>
            <dd className="text-ink-muted text-xs">
              {dose?.spacing
                ? `${plural(protocol.sessionsPerDay ?? 1, 'session')} with ${protocol.minHoursBetween ?? 0} h between them need ${formatNumber(dose.spacing.hoursNeeded, 1)} h of a 16-hour waking day.`
                : 'Needs sessions per day and the minimum hours between them.'}
            </dd>
          </div>
        </dl>
      </div>
    </section>
  );
}
