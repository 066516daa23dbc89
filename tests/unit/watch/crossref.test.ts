import { describe, expect, it } from 'vitest';
import { noticesOf, retryAfterMs } from '@/lib/watch/crossref';
import { formatNoticeDate, headlineNotice } from '@/lib/watch/notices';

describe('reading a Crossref work record', () => {
  it('takes retractions and corrections from updated-by, with the notice DOI and date, and ignores other update types', () => {
    // Shape of the Crossref REST API's /works/{doi} message (relations as the API sends them; from memory).
    const message = {
      DOI: '10.5555/a',
      'updated-by': [
        { DOI: '10.5555/R1', type: 'retraction', label: 'Retraction', updated: { 'date-parts': [[2026, 11, 20]] } },
        { DOI: '10.5555/c1', type: 'correction', updated: { 'date-parts': [[2025, 3]] } },
        { DOI: '10.5555/v2', type: 'new_version', updated: { 'date-parts': [[2025, 1, 1]] } },
        { type: 'retraction' },
      ],
    };
    expect(noticesOf(message, '10.5555/a')).toEqual([
      { kind: 'retraction', noticeDoi: '10.5555/r1', date: '2026-11-20' },
      { kind: 'correction', noticeDoi: '10.5555/c1', date: '2025-03' },
    ]);
  });

  it('marks a record that is itself a notice (update-to) as pointing at itself', () => {
    const message = {
      'update-to': [{ DOI: '10.5555/orig', type: 'expression_of_concern', updated: { 'date-parts': [[2026, 1, 2]] } }],
    };
    expect(noticesOf(message, '10.5555/eoc')).toEqual([
      { kind: 'expression_of_concern', noticeDoi: '10.5555/eoc', date: '2026-01-02' },
    ]);
  });

  it('has no notices for a plain record', () => {
    expect(noticesOf({ DOI: '10.5555/x', title: ['T'] }, '10.5555/x')).toEqual([]);
  });
});

describe('Retry-After (RFC 9110 §10.2.3: delay-seconds or an HTTP-date)', () => {
  it('reads seconds and dates, and refuses what it cannot read', () => {
    expect(retryAfterMs('3')).toBe(3000);
    const now = Date.parse('Wed, 02 Dec 2026 21:00:00 GMT');
    expect(retryAfterMs('Wed, 02 Dec 2026 21:00:10 GMT', now)).toBe(10_000);
    expect(retryAfterMs('Wed, 02 Dec 2026 20:00:00 GMT', now)).toBe(0);
    expect(retryAfterMs('soon')).toBeNull();
    expect(retryAfterMs(null)).toBeNull();
  });
});

describe('the notice a study shows', () => {
  it('is the most serious, then the latest', () => {
    const correction = { kind: 'correction' as const, noticeDoi: 'c', date: '2026-12-01' };
    const retraction = { kind: 'retraction' as const, noticeDoi: 'r', date: '2020-01-01' };
    const later = { ...correction, noticeDoi: 'c2', date: '2026-12-02' };
    expect(headlineNotice([correction, retraction])).toBe(retraction);
    expect(headlineNotice([correction, later])).toBe(later);
    expect(headlineNotice([])).toBeNull();
  });

  it('writes dates in fixed words', () => {
    expect(formatNoticeDate('2026-11-20')).toBe('20 Nov 2026');
    expect(formatNoticeDate('2025-03')).toBe('Mar 2025');
    expect(formatNoticeDate('2024')).toBe('2024');
  });
});
