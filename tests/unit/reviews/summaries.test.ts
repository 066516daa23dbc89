import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { protocolSummary } from '@/components/review/summaries';
import { ScorecardHeader } from '@/components/rounds/scorecard/ScorecardHeader';
import type { ProtocolDTO } from '@/lib/reviews/types';

// The workbench header and the reviewer's scorecard describe the claim's protocol and population
// with one function, so a plural or a label cannot be right in one and wrong in the other.

const protocol = (over: Partial<ProtocolDTO> = {}): ProtocolDTO => ({
  exercise: 'Pinch-block lift',
  loadValue: 30,
  loadUnit: 'percent-max',
  referenceBodyweightKg: null,
  referenceMaxAddedKg: null,
  secondsPerSet: 10,
  setsPerSession: 1,
  sessionsPerDay: 1,
  daysPerWeek: 1,
  minHoursBetween: null,
  weeks: 1,
  effort: 'easy',
  intensity: 0.3,
  ...over,
});

describe('the protocol and population in one line', () => {
  it('counts in the singular for one and the plural for more', () => {
    expect(protocolSummary(protocol())).toBe(
      'Pinch-block lift · 30 % of max · 10 s × 1 set × 1 session/day · 1 day/week · 1 week · effort easy',
    );
    expect(protocolSummary(protocol({ setsPerSession: 3, sessionsPerDay: 2, daysPerWeek: 7, weeks: 8 }))).toContain(
      '× 3 sets × 2 sessions/day · 7 days/week · 8 weeks',
    );
  });

  it('reads the same on the reviewer’s scorecard, with the population’s label', () => {
    const html = renderToStaticMarkup(
      createElement(ScorecardHeader, {
        round: { status: 'open', dueAt: '2026-12-07T06:00:00.000Z' } as never,
        review: {
          title: 'Light pinch-block lifts',
          claim: 'Four light sets a day stiffen thumb tendons.',
          claimSource: 'A video',
          authorName: 'A coach',
          protocol: protocol({ sessionsPerDay: 4 }),
          population: { status: 'recreational', injured: false },
        } as never,
        submittedAt: null,
      }),
    );
    expect(html).toContain('10 s × 1 set × 4 sessions/day');
    expect(html).toContain('Recreational, healthy');
  });
});
