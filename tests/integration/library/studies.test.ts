import { readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as reviewVerdict from '@/app/api/reviews/[id]/verdict/route';
import * as reviews from '@/app/api/reviews/route';
import * as citation from '@/app/api/studies/[id]/citation/route';
import * as one from '@/app/api/studies/[id]/route';
import * as studies from '@/app/api/studies/route';
import { importSource } from '@/lib/library/import';
import { newStudyRow } from '@/lib/library/studies';
import { Appraisal, Study } from '@/models';
import { Client, useTestApp } from '../../helpers/app';
import { makeTeam, newReview, snapshot, useDoiFakeAndStorage, type TeamFixture } from '../reviews/helpers';

useTestApp();
const fake = useDoiFakeAndStorage();
let t: TeamFixture;
const fixture = (name: string) => readFileSync(path.resolve(__dirname, '../../../fixtures/citations', name), 'utf8');
const add = (client: Client, json: Record<string, unknown>) => client.call(studies.POST, { json });

beforeAll(async () => {
  t = await makeTeam('st');
});

describe('POST /api/studies — pasted BibTeX, RIS, CSL-JSON or DOIs', () => {
  it('adds every readable BibTeX entry and names the broken ones, entry by entry', async () => {
    const res = await add(t.coach, { teamId: t.teamId, source: fixture('library.bib'), design: 'randomized' });
    expect(res.status).toBe(201);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual([
      'added',
      'added',
      'added',
      'added',
      'failed',
      'failed',
    ]);
    expect(res.body.results[4]).toEqual({
      index: 4,
      title: 'This Entry Has No Comma after Its Key',
      status: 'failed',
      reason: 'Could not read the BibTeX entry at line 48: expected "comma", got "label" (line 49).',
    });
    expect(res.body.results[5]).toMatchObject({
      status: 'failed',
      reason: 'The BibTeX entry at line 54 has no title.',
    });
    const holt = res.body.studies.find((s: { doi: string }) => s.doi === '10.5555/hjts.2024.0312');
    expect(holt).toMatchObject({
      citation: 'Holt & Wren, 2024',
      year: 2024,
      journal: 'Hollowridge Journal of Training Science',
      design: 'randomized',
      hasPdf: false,
      appraisalCount: 0,
    });
    // Each result points at the study made from that entry.
    for (const r of res.body.results.filter((x: { status: string }) => x.status === 'added')) {
      expect(res.body.studies.find((s: { id: number }) => s.id === r.studyId).title).toBe(r.title);
    }
    expect(await Study.count({ where: { teamId: t.teamId } })).toBe(4);
  });

  it('says "already in the library" on a second paste, by DOI and (without one) by title and year', async () => {
    const before = await snapshot();
    const res = await add(t.coach, { teamId: t.teamId, source: fixture('library.bib') });
    expect(res.status).toBe(200);
    expect(res.body.results.slice(0, 4).map((r: { status: string }) => r.status)).toEqual([
      'duplicate',
      'duplicate',
      'duplicate',
      'duplicate',
    ]);
    expect(res.body.results[0].reason).toBe('Already in the library as Holt & Wren, 2024.');
    expect(res.body.studies).toHaveLength(4);
    expect((await snapshot()).studies).toEqual(before.studies);
  });

  it('reads RIS and CSL-JSON, and marks a repeat within one paste as a duplicate of the first', async () => {
    const ris = await add(t.coach, { teamId: t.teamId, source: fixture('library.ris') });
    expect(ris.body.results.map((r: { status: string }) => r.status)).toEqual(['added', 'added', 'failed']);
    const json = await add(t.coach, { teamId: t.teamId, source: fixture('library.json') });
    expect(json.body.results.map((r: { status: string }) => r.status)).toEqual(['added', 'failed']);
    const twice = JSON.stringify([
      { type: 'article-journal', title: 'Repeated entry about grip', issued: { 'date-parts': [[2019]] } },
      { type: 'article-journal', title: 'Repeated entry about grip', issued: { 'date-parts': [[2019]] } },
    ]);
    const rep = await add(t.coach, { teamId: t.teamId, source: twice });
    expect(rep.body.results[1]).toMatchObject({
      status: 'duplicate',
      studyId: rep.body.results[0].studyId,
      reason: 'Appears earlier in this import (entry 1).',
    });
  });

  it('looks DOIs up through the DOI service (the local fake): found ones are added, unknown ones fail with a reason and add nothing', async () => {
    const before = await Study.count();
    const res = await add(t.coach, {
      teamId: t.teamId,
      source:
        'https://doi.org/10.5555/HJTS.2025.0012\n10.5555/does-not-exist\n10.5555/fake.unavailable 10.5555/fake.untitled',
    });
    expect(res.status).toBe(201);
    expect(res.body.results).toEqual([
      {
        index: 0,
        title: 'Hangboard protocols and finger strength in youth climbers: A randomized trial',
        status: 'added',
        studyId: expect.any(Number),
        // The title names the design, so it is offered for the coach to confirm.
        suggestedDesign: 'randomized',
      },
      {
        index: 1,
        title: '10.5555/does-not-exist',
        status: 'failed',
        reason: 'No record found for DOI 10.5555/does-not-exist; check it for typos.',
      },
      { index: 2, title: '10.5555/fake.unavailable', status: 'failed', reason: expect.stringMatching(/answered 503/) },
      {
        index: 3,
        title: '10.5555/fake.untitled',
        status: 'failed',
        reason: 'The record for DOI 10.5555/fake.untitled has no title, so it was not added.',
      },
    ]);
    expect(await Study.count()).toBe(before + 1);
    expect(res.body.studies[0]).toMatchObject({ doi: '10.5555/hjts.2025.0012', citation: 'Vindahl, 2025' });
    // A DOI already in the library is answered without asking the service again.
    const asked = fake.doi().requests;
    const again = await add(t.coach, { teamId: t.teamId, source: '10.5555/hjts.2025.0012' });
    expect(again.body.results[0]).toMatchObject({ status: 'duplicate', studyId: res.body.results[0].studyId });
    expect(fake.doi().requests).toBe(asked);
  });

  it('fails a chunk alone, with a sentence, when another writer added one of its DOIs after the library was read', async () => {
    const doi = '10.5555/race.0001';
    const csl = {
      type: 'article-journal',
      title: 'Grip work read twice',
      DOI: doi,
      issued: { 'date-parts': [[2024]] },
    };
    const result = await importSource(t.teamId, t.userIds.coach, doi, {
      format: 'doi',
      // The lookup runs after the library's DOIs were read: a write now (another process, say)
      // is seen only by the unique index when the chunk is inserted.
      lookup: async () => {
        await Study.create(newStudyRow(t.teamId, t.userIds.coach, csl, {}) as never);
        return { ok: true, csl };
      },
    });
    expect(result.results).toEqual([
      {
        index: 0,
        title: 'Grip work read twice',
        status: 'failed',
        reason: 'Another import added some of these studies at the same moment; import again to see which are new.',
      },
    ]);
    expect(await Study.count({ where: { teamId: t.teamId, doi } })).toBe(1);
  });

  it('answers an unreadable paste with one failed entry and adds nothing', async () => {
    const before = await snapshot();
    const res = await add(t.coach, { teamId: t.teamId, source: 'light daily hangs make fingers stronger' });
    expect(res.status).toBe(200);
    expect(res.body.results).toEqual([
      {
        index: 0,
        title: null,
        status: 'failed',
        reason: 'Could not tell the format: paste a DOI, BibTeX, RIS or CSL-JSON.',
      },
    ]);
    expect((await snapshot()).studies).toEqual(before.studies);
  });

  it('streams progress lines when asked for NDJSON', async () => {
    const entries = Array.from(
      { length: 120 },
      (_, i) => `@article{k${i}, title={Streamed study number ${i}}, author={Vale, Jonah}, year={2018}}`,
    ).join('\n');
    const req = new Request('http://app.test/api/studies', {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        accept: 'application/x-ndjson',
        cookie: t.coach.cookie,
        'x-forwarded-for': t.coach.address,
      },
      body: JSON.stringify({ teamId: t.teamId, source: entries }),
    });
    const res = await studies.POST(req, { params: Promise.resolve({}) });
    expect(res.headers.get('content-type')).toMatch(/application\/x-ndjson/);
    const lines = (await res.text())
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(lines.filter((l) => l.type === 'progress').length).toBeGreaterThanOrEqual(2);
    expect(lines.some((l) => l.type === 'progress' && l.phase === 'reading' && l.total === 120)).toBe(true);
    const last = lines.at(-1);
    expect(last.type).toBe('result');
    expect(last.results.filter((r: { status: string }) => r.status === 'added')).toHaveLength(120);
  });
});

describe('POST /api/studies — by hand', () => {
  it('builds the CSL-JSON from the form and detects a duplicate by title and year', async () => {
    const json = {
      teamId: t.teamId,
      title: 'Finger strength after a winter of board climbing',
      authors: [{ family: 'Ostby', given: 'Runa' }, { literal: 'Hollowridge Coaching Panel' }],
      year: 2021,
      journal: 'Hollowridge Journal of Training Science',
      volume: '9',
      issue: '4',
      pages: '300–310',
      doi: null,
      design: 'cohort',
      population: 'trained',
      n: 41,
      intensity: 0.85,
      durationWeeks: 16,
      outcome: 'Max hang, kg',
      effect: { kind: 'means', m1: 12, sd1: 4, n1: 20, m2: 8, sd2: 4, n2: 21 },
      tags: ['Fingers'],
    };
    const res = await add(t.coach, json);
    expect(res.status).toBe(201);
    const study = res.body.studies[0];
    expect(study).toMatchObject({
      citation: 'Ostby & Hollowridge Coaching Panel, 2021',
      design: 'cohort',
      n: 41,
      tags: ['fingers'],
      effect: json.effect,
    });
    expect(study.csl).toMatchObject({
      type: 'article-journal',
      page: '300-310',
      volume: '9',
      issue: '4',
      author: [{ family: 'Ostby', given: 'Runa' }, { literal: 'Hollowridge Coaching Panel' }],
    });
    const again = await add(t.coach, {
      teamId: t.teamId,
      title: 'Finger Strength After a Winter of Board-Climbing',
      year: 2021,
    });
    expect(again.status).toBe(200);
    expect(again.body.results[0]).toMatchObject({ status: 'duplicate', studyId: study.id });
  });

  it('refuses bad input with a 400 naming the field, and changes nothing', async () => {
    const before = await snapshot();
    const cases: [string, Record<string, unknown> | string, string][] = [
      ['neither source nor title', { teamId: t.teamId }, 'source'],
      ['both source and fields', { teamId: t.teamId, source: '10.5555/x.1', title: 'Both at once' }, 'title'],
      ['a bad DOI', { teamId: t.teamId, title: 'A study', doi: 'not-a-doi' }, 'doi'],
      [
        'an SD of zero',
        { teamId: t.teamId, title: 'A study', effect: { kind: 'means', m1: 1, sd1: 0, n1: 5, m2: 1, sd2: 1, n2: 5 } },
        'effect.sd1',
      ],
      [
        'an empty 2×2 arm',
        {
          teamId: t.teamId,
          title: 'A study',
          effect: { kind: 'two-by-two', a: 0, b: 0, c: 1, d: 1, measure: 'risk-ratio' },
        },
        'effect.a',
      ],
      ['an unknown effect kind', { teamId: t.teamId, title: 'A study', effect: { kind: 'hazard' } }, 'effect.kind'],
      ['intensity as a percentage', { teamId: t.teamId, title: 'A study', intensity: 80 }, 'intensity'],
      ['wrong types', { teamId: 'mine', title: 7, authors: 'Holt' }, 'teamId'],
      ['an array', [1] as unknown as Record<string, unknown>, ''],
    ];
    for (const [label, json, field] of cases) {
      const res = await add(t.coach, json as Record<string, unknown>);
      expect(res.status, label).toBe(400);
      expect(
        res.body.issues.map((i: { path: string }) => i.path),
        label,
      ).toContain(field);
    }
    expect((await t.coach.call(studies.POST, { rawBody: '{"teamId":' })).status).toBe(400);
    expect((await t.coach.call(studies.POST, { method: 'POST', rawBody: '' })).status).toBe(400);
    expect(await snapshot()).toEqual(before);
  });

  it('is for owners and coaches: reviewers and athletes 403, outsiders 404, signed out 401', async () => {
    const before = await snapshot();
    const json = { teamId: t.teamId, title: 'Not allowed to add' };
    expect((await add(t.reviewer, json)).status).toBe(403);
    expect((await add(t.athlete, json)).status).toBe(403);
    expect((await add(t.outsider, json)).status).toBe(404);
    expect((await add(t.anonymous, json)).status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });
});

describe('GET /api/studies — the library table', () => {
  const list = (query: string, client = t.coach) => client.call(studies.GET, { path: `/api/studies?${query}` });

  it('pages, sorts, searches and filters', async () => {
    const total = await Study.count({ where: { teamId: t.teamId } });
    const page1 = await list(`teamId=${t.teamId}&pageSize=5&sort=title`);
    expect(page1.body).toMatchObject({ total, page: 1, pageSize: 5 });
    expect(page1.body.studies).toHaveLength(5);
    const titles = page1.body.studies.map((s: { title: string }) => s.title);
    expect([...titles].sort((a, b) => (a < b ? -1 : 1))).toEqual(titles);
    const page2 = await list(`teamId=${t.teamId}&pageSize=5&sort=title&page=2`);
    expect(page2.body.studies[0].title >= titles[4]).toBe(true);
    const byYear = await list(`teamId=${t.teamId}&sort=-year&pageSize=200`);
    const years = byYear.body.studies.map((s: { year: number | null }) => s.year ?? -1);
    expect([...years].sort((a, b) => b - a)).toEqual(years);
    const q = await list(`teamId=${t.teamId}&q=${encodeURIComponent('COLD-water')}`);
    expect(q.body.studies.map((s: { citation: string }) => s.citation)).toEqual(['Okafor et al., 2023']);
    // % in the search is a character, not a wildcard.
    expect((await list(`teamId=${t.teamId}&q=%25`)).body.total).toBe(0);
    const design = await list(`teamId=${t.teamId}&design=cohort`);
    expect(design.body.studies.every((s: { design: string }) => s.design === 'cohort')).toBe(true);
    expect(design.body.total).toBe(1);
    const tag = await list(`teamId=${t.teamId}&tag=fingers`);
    expect(tag.body.studies.map((s: { title: string }) => s.title)).toEqual([
      'Finger strength after a winter of board climbing',
    ]);
  });

  it('never shows another team’s studies; reviewers read, athletes 403, outsiders 404; bad queries 400', async () => {
    await add(t.outsider, { teamId: t.otherTeamId, title: 'Outsider’s own study' });
    const mine = await list('pageSize=200');
    expect(mine.body.studies.every((s: { teamId: number }) => s.teamId === t.teamId)).toBe(true);
    expect((await list(`teamId=${t.teamId}`, t.reviewer)).status).toBe(200);
    expect((await list(`teamId=${t.teamId}`, t.athlete)).status).toBe(403);
    expect((await list(`teamId=${t.teamId}`, t.outsider)).status).toBe(404);
    expect((await list('pageSize=1000')).status).toBe(400);
    expect((await list('sort=popularity')).status).toBe(400);
    expect((await list('page=0')).status).toBe(400);
  });
});

describe('one study: read, change, cite, delete', () => {
  let studyId: number;
  let reviewId: number;

  beforeAll(async () => {
    studyId = (await Study.findOne({ where: { teamId: t.teamId, doi: '10.5555/hjts.2024.0312' } }))!.id;
    reviewId = (await t.coach.call(reviews.POST, { json: newReview(t.teamId) })).body.review.id;
    const res = await t.coach.call(appraisals.POST, {
      params: { id: String(reviewId) },
      json: { studyId, direction: 'supports' },
    });
    expect(res.status).toBe(201);
  });

  it('GET shows the study with its appraisals across reviews', async () => {
    const res = await t.reviewer.call(one.GET, { params: { id: String(studyId) } });
    expect(res.status).toBe(200);
    expect(res.body.study).toMatchObject({ id: studyId, appraisalCount: 1 });
    expect(res.body.appraisals).toEqual([
      expect.objectContaining({ reviewId, reviewTitle: expect.any(String), mechanismName: null, certainty: 'high' }),
    ]);
    expect((await t.athlete.call(one.GET, { params: { id: String(studyId) } })).status).toBe(403);
    expect((await t.outsider.call(one.GET, { params: { id: String(studyId) } })).status).toBe(404);
  });

  it('PATCH changes the reference and the appraisal fields, and every review that uses the study sees it', async () => {
    const before = (await t.coach.call(reviewVerdict.GET, { params: { id: String(reviewId) } })).body;
    expect(before.appraisals[0].certainty).toBe('high');
    const res = await t.coach.call(one.PATCH, {
      method: 'PATCH',
      params: { id: String(studyId) },
      json: { design: 'case-series', year: 2023, tags: ['thumb'] },
    });
    expect(res.status).toBe(200);
    expect(res.body.study).toMatchObject({
      design: 'case-series',
      year: 2023,
      citation: 'Holt & Wren, 2023',
      tags: ['thumb'],
    });
    expect(res.body.study.csl.issued).toEqual({ 'date-parts': [[2023]] });
    const after = (await t.coach.call(reviewVerdict.GET, { params: { id: String(reviewId) } })).body;
    expect(after.appraisals[0].certainty).toBe('very-low');
  });

  it('PATCH refuses clearing the design of an appraised study (409), a DOI another study has (409), and bad input (400)', async () => {
    const before = await snapshot();
    expect(
      (await t.coach.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, json: { design: null } }))
        .status,
    ).toBe(409);
    const taken = await t.coach.call(one.PATCH, {
      method: 'PATCH',
      params: { id: String(studyId) },
      json: { doi: '10.5555/HJTS.2023.0101' },
    });
    expect(taken.status).toBe(409);
    expect(taken.body.error).toMatch(/Okafor et al\., 2023/);
    expect((await t.coach.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, json: {} })).status).toBe(
      400,
    );
    expect(
      (await t.coach.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, json: { n: -3 } })).status,
    ).toBe(400);
    expect(
      (await t.coach.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, rawBody: '{' })).status,
    ).toBe(400);
    expect(
      (await t.reviewer.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, json: { n: 3 } })).status,
    ).toBe(403);
    expect(
      (await t.outsider.call(one.PATCH, { method: 'PATCH', params: { id: String(studyId) }, json: { n: 3 } })).status,
    ).toBe(404);
    expect(await snapshot()).toEqual(before);
  });

  it('formats the reference as APA, BibTeX, RIS and CSL-JSON, and as a download', async () => {
    const apa = await t.reviewer.call(citation.GET, { params: { id: String(studyId) }, path: '/x?format=apa' });
    expect(apa.status).toBe(200);
    expect(apa.body).toMatchObject({ format: 'apa', mediaType: 'text/plain; charset=utf-8' });
    expect(apa.body.text).toBe(
      'Holt, M. A., & Wren, T. (2023). Daily light pinch lifts and thumb tendon stiffness in MVC testing: A randomized trial. ' +
        'Hollowridge Journal of Training Science, 12(3), 101–115. https://doi.org/10.5555/hjts.2024.0312',
    );
    const bib = await t.coach.call(citation.GET, { params: { id: String(studyId) }, path: '/x?format=bibtex' });
    expect(bib.body.text).toMatch(/^@article\{holt2024daily,/);
    const ris = await t.coach.call(citation.GET, { params: { id: String(studyId) }, path: '/x?format=ris' });
    expect(ris.body.text).toMatch(/^TY {2}- JOUR$/m);
    const csl = await t.coach.call(citation.GET, { params: { id: String(studyId) }, path: '/x?format=csl' });
    expect(JSON.parse(csl.body.text)[0]).toMatchObject({ DOI: '10.5555/hjts.2024.0312', type: 'article-journal' });
    const req = new Request('http://app.test/x?format=bibtex&download=1', { headers: { cookie: t.coach.cookie } });
    const file = await citation.GET(req, { params: Promise.resolve({ id: String(studyId) }) });
    expect(file.headers.get('content-type')).toBe('application/x-bibtex; charset=utf-8');
    expect(file.headers.get('content-disposition')).toBe('attachment; filename="holt2024daily.bib"');
    expect(await file.text()).toMatch(/^@article/);
    expect((await t.coach.call(citation.GET, { params: { id: String(studyId) }, path: '/x?format=mla' })).status).toBe(
      400,
    );
    expect((await t.athlete.call(citation.GET, { params: { id: String(studyId) } })).status).toBe(403);
    expect((await t.outsider.call(citation.GET, { params: { id: String(studyId) } })).status).toBe(404);
  });

  it('DELETE of a study in use is a 409 saying how many appraisals in which reviews, and deletes nothing', async () => {
    const before = await snapshot();
    const res = await t.coach.call(one.DELETE, { method: 'DELETE', params: { id: String(studyId) } });
    expect(res.status).toBe(409);
    expect(res.body).toEqual({
      error: expect.stringMatching(/^1 appraisal in 1 review use/),
      appraisalCount: 1,
      reviews: [{ id: reviewId, title: expect.any(String) }],
    });
    expect(await snapshot()).toEqual(before);
    expect(
      (await t.reviewer.call(one.DELETE, { method: 'DELETE', params: { id: String(studyId) }, path: '/x?force=1' }))
        .status,
    ).toBe(403);
    expect(
      (await t.outsider.call(one.DELETE, { method: 'DELETE', params: { id: String(studyId) }, path: '/x?force=1' }))
        .status,
    ).toBe(404);
    expect(
      (await t.coach.call(one.DELETE, { method: 'DELETE', params: { id: String(studyId) }, path: '/x?force=yes' }))
        .status,
    ).toBe(400);
  });

  it('DELETE with force=1 removes the study and its appraisals, and the review’s verdict follows', async () => {
    const res = await t.coach.call(one.DELETE, {
      method: 'DELETE',
      params: { id: String(studyId) },
      path: '/x?force=1',
    });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ study: { id: studyId }, deletedAppraisals: 1 });
    expect(await Study.count({ where: { id: studyId } })).toBe(0);
    expect(await Appraisal.count({ where: { studyId } })).toBe(0);
    const list = await t.coach.call(reviews.GET, { path: `/api/reviews?teamId=${t.teamId}` });
    expect(list.body.reviews.find((r: { id: number }) => r.id === reviewId).verdict).toBe('insufficient');
    expect((await t.coach.call(one.GET, { params: { id: String(studyId) } })).status).toBe(404);
  });

  it('deletes an unused study without asking', async () => {
    const created = await add(t.coach, { teamId: t.teamId, title: 'A study nobody appraised', year: 2017 });
    const res = await t.coach.call(one.DELETE, {
      method: 'DELETE',
      params: { id: String(created.body.studies[0].id) },
    });
    expect(res.status).toBe(200);
    expect(res.body.deletedAppraisals).toBe(0);
  });
});
