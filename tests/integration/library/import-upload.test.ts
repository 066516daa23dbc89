import { readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as oneStudy from '@/app/api/studies/[id]/route';
import * as importRoute from '@/app/api/studies/import/route';
import { Study } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, sendForm, snapshot, useDoiFakeAndStorage, type TeamFixture } from '../reviews/helpers';

useTestApp();
useDoiFakeAndStorage();
let t: TeamFixture;
const bytes = (name: string) => new Uint8Array(readFileSync(path.resolve('fixtures/citations', name)));

beforeAll(async () => {
  t = await makeTeam('im');
});

describe('POST /api/studies/import — a .bib, .ris or .json file', () => {
  it('imports the BibTeX fixture with a result per entry', async () => {
    const res = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'library.bib', type: 'application/x-bibtex', bytes: bytes('library.bib') },
    });
    expect(res.status).toBe(201);
    expect(res.body.results.map((r: { status: string }) => r.status)).toEqual([
      'added',
      'added',
      'added',
      'added',
      'failed',
      'failed',
    ]);
    expect(res.body.studies).toHaveLength(4);
  });

  // The chunks are written as plain rows, not through the model: they must read back the same.
  it('answers with each added study as the library then reads it', async () => {
    const team = await makeTeam('rb');
    const res = await sendForm(team.coach, importRoute.POST, {
      fields: { teamId: String(team.teamId) },
      file: { name: 'library.bib', type: 'application/x-bibtex', bytes: bytes('library.bib') },
    });
    expect(res.status).toBe(201);
    const added = (res.body.results as { status: string; studyId?: number; title: string }[]).filter(
      (r) => r.status === 'added',
    );
    expect(added).toHaveLength(4);
    for (const result of added) {
      const answered = res.body.studies.find((s: { id: number }) => s.id === result.studyId);
      expect(answered.title).toBe(result.title);
      const read = await team.coach.call(oneStudy.GET, { params: { id: String(result.studyId) } });
      expect(read.status).toBe(200);
      expect(read.body.study).toEqual(answered);
    }
    const row = await Study.findByPk(added[0].studyId);
    expect(row!.createdAt.getTime()).toBe(new Date(res.body.studies[0].createdAt).getTime());
    expect(row!.tags).toEqual([]);
    expect(row!.injured).toBe(false);
    expect(row!.evidenceNotice).toBeNull();
  });

  it('imports RIS and CSL-JSON files by their extension', async () => {
    const ris = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'export.RIS', type: 'application/octet-stream', bytes: bytes('library.ris') },
    });
    expect(ris.body.results.map((r: { status: string }) => r.status)).toEqual(['added', 'added', 'failed']);
    const json = await sendForm(t.owner, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'items.json', type: 'application/json', bytes: bytes('library.json') },
    });
    expect(json.body.results.map((r: { status: string }) => r.status)).toEqual(['added', 'failed']);
  });

  it('reads a file whose content does not match its extension as failed entries, not a crash', async () => {
    const res = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'wrong.bib', type: 'text/plain', bytes: bytes('library.ris') },
    });
    expect(res.status).toBe(200);
    expect(res.body.results).toEqual([
      { index: 0, title: null, status: 'failed', reason: expect.stringMatching(/No BibTeX entries found/) },
    ]);
  });

  it('refuses other file types (415), oversized uploads (413), a missing file or team (400) — storing nothing', async () => {
    const before = await snapshot();
    const pdf = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'paper.pdf', type: 'application/pdf', bytes: new Uint8Array([0x25, 0x50, 0x44, 0x46, 0x2d]) },
    });
    expect(pdf.status).toBe(415);
    // Declared too large: refused from the header, before the body is read.
    const declared = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'big.bib', type: 'text/plain', bytes: bytes('library.bib') },
      headers: { 'content-length': String(11 * 1024 * 1024) },
    });
    expect(declared.status).toBe(413);
    // Actually too large (an 11 MB file) with an honest length.
    const big = new Uint8Array(11 * 1024 * 1024).fill(0x20);
    const real = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'big.bib', type: 'text/plain', bytes: big },
    });
    expect(real.status).toBe(413);
    const noFile = await sendForm(t.coach, importRoute.POST, { fields: { teamId: String(t.teamId) } });
    expect(noFile.status).toBe(400);
    expect(noFile.body.issues).toEqual([{ path: 'file', message: 'Required.' }]);
    const noTeam = await sendForm(t.coach, importRoute.POST, {
      file: { name: 'library.bib', type: 'text/plain', bytes: bytes('library.bib') },
    });
    expect(noTeam.status).toBe(400);
    expect(noTeam.body.issues[0].path).toBe('teamId');
    const json = await t.coach.call(importRoute.POST, { json: { teamId: t.teamId } });
    expect(json.status).toBe(415);
    expect(await snapshot()).toEqual(before);
  });

  it('is for owners and coaches of the team', async () => {
    const before = await snapshot();
    const form = {
      fields: { teamId: String(t.teamId) },
      file: { name: 'library.bib', type: 'text/plain', bytes: bytes('library.bib') },
    };
    expect((await sendForm(t.reviewer, importRoute.POST, form)).status).toBe(403);
    expect((await sendForm(t.athlete, importRoute.POST, form)).status).toBe(403);
    expect((await sendForm(t.outsider, importRoute.POST, form)).status).toBe(404);
    expect((await sendForm(t.anonymous, importRoute.POST, form)).status).toBe(401);
    expect(await snapshot()).toEqual(before);
  });

  // Its speed is measured in bench/import.ts, never asserted here: a busy machine would fail it.
  it('imports a generated 2,000-entry BibTeX file, streaming progress', { timeout: 180_000 }, async () => {
    const entries = Array.from(
      { length: 2000 },
      (_, i) =>
        `@article{gen${i},\n  author = {Vale, Jonah and Lindqvist, Sofie and Ostby, Runa},\n  title = {Generated study number ${i} on grip endurance},\n` +
        `  journal = {Hollowridge Journal of Training Science},\n  year = {${2000 + (i % 25)}},\n  volume = {${1 + (i % 13)}},\n  pages = {${i}--${i + 9}},\n  doi = {10.5555/gen.${i}}\n}\n`,
    ).join('\n');
    const res = await sendForm(t.coach, importRoute.POST, {
      fields: { teamId: String(t.teamId) },
      file: { name: 'big-library.bib', type: 'text/plain', bytes: new TextEncoder().encode(entries) },
      headers: { accept: 'application/x-ndjson' },
    });
    const lines = (res.body as string)
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    const result = lines.at(-1);
    expect(result.type).toBe('result');
    expect(result.results.filter((r: { status: string }) => r.status === 'added')).toHaveLength(2000);
    expect(lines.filter((l) => l.type === 'progress').length).toBeGreaterThan(3);
    expect(await Study.count({ where: { teamId: t.teamId, doi: '10.5555/gen.1999' } })).toBe(1);
    // Each result names the study its own entry became, in every chunk of 500.
    for (const i of [0, 499, 500, 1234, 1999]) {
      const row = await Study.findByPk(result.results[i].studyId);
      expect(row!.doi).toBe(`10.5555/gen.${i}`);
    }
  });
});

describe('POST /api/studies/import — a real-world-shaped .bib file', () => {
  it('stores plain-text titles, journals and names, names the broken entry by its line, and suggests designs', async () => {
    const team = await makeTeam('rw');
    const res = await sendForm(team.coach, importRoute.POST, {
      fields: { teamId: String(team.teamId) },
      file: { name: 'real-world.bib', type: 'application/x-bibtex', bytes: bytes('real-world.bib') },
    });
    expect(res.status).toBe(201);
    const results = res.body.results as {
      status: string;
      reason?: string;
      suggestedDesign?: string;
      studyId?: number;
    }[];
    expect(results.filter((r) => r.status === 'added')).toHaveLength(15);
    expect(results[14]).toMatchObject({
      status: 'failed',
      reason: expect.stringMatching(/^Could not read the BibTeX entry at line 129/),
    });
    // The design a title names is offered, not set.
    expect(results[2]).toMatchObject({ status: 'added', suggestedDesign: 'randomized' });
    expect(results[1].suggestedDesign).toBeUndefined();
    const rows = await Study.findAll({ where: { teamId: team.teamId }, order: [['id', 'ASC']] });
    expect(rows.every((s) => s.design === null)).toBe(true);
    // What the library sorts, searches and shows is plain Unicode: no TeX, no braces, no parser markup.
    for (const s of rows) expect(JSON.stringify([s.title, s.journal, s.citation])).not.toMatch(/[{}<>]|\\[A-Za-z]/);
    const holt = rows.find((s) => s.citation === 'Holt & Hollowridge Coaching Panel, 2022')!;
    expect(holt.title).toBe('The TeX of training logs and the LaTeX athlete: Typesetting “Load” — a narrative');
    expect(holt.journal).toBe('Training & Recovery');
    expect(rows.find((s) => s.citation === 'Müller et al., 2021')).toBeDefined();
    // The library list carries the suggestion too, until a design is confirmed.
    const listed = res.body.studies.find((s: { id: number }) => s.id === results[2].studyId);
    expect(listed.suggestedDesign).toBe('randomized');
  });

  it('offers a design on the added entry, not on a repeat of it later in the same file', async () => {
    const team = await makeTeam('rp');
    const entry = (key: string) =>
      `@article{${key},\n  author = {Vale, Jonah},\n  title = {Hangboard loading in trained climbers: a randomised controlled trial},\n` +
      `  journal = {Hollowridge Journal of Training Science},\n  year = {2023},\n  doi = {10.5555/repeat.1}\n}\n`;
    const res = await sendForm(team.coach, importRoute.POST, {
      fields: { teamId: String(team.teamId) },
      file: {
        name: 'repeat.bib',
        type: 'application/x-bibtex',
        bytes: new TextEncoder().encode(entry('a') + entry('b')),
      },
    });
    const [first, repeat] = res.body.results;
    expect(first).toMatchObject({ status: 'added', suggestedDesign: 'randomized' });
    expect(repeat).toMatchObject({ status: 'duplicate', studyId: first.studyId });
    expect(repeat.suggestedDesign).toBeUndefined();
  });

  it('answers a second import of the same file with duplicates and adds nothing', async () => {
    const team = await makeTeam('rw2');
    const send = () =>
      sendForm(team.coach, importRoute.POST, {
        fields: { teamId: String(team.teamId) },
        file: { name: 'real-world.bib', type: 'application/x-bibtex', bytes: bytes('real-world.bib') },
      });
    await send();
    const before = await Study.count({ where: { teamId: team.teamId } });
    const again = await send();
    expect(again.status).toBe(200);
    expect(again.body.results.filter((r: { status: string }) => r.status === 'duplicate')).toHaveLength(15);
    expect(await Study.count({ where: { teamId: team.teamId } })).toBe(before);
  });
});
