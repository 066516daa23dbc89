import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import * as file from '@/app/api/studies/[id]/file/route';
import * as studies from '@/app/api/studies/route';
import { Study } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, sendForm, useDoiFakeAndStorage, type TeamFixture } from '../reviews/helpers';

// Uploads of a study's PDF at the same moment: the one stored is the last one; no file is left behind.
useTestApp();
const env = useDoiFakeAndStorage();
let t: TeamFixture;
let studyId: number;

function storedFiles(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    if (!existsSync(dir)) return;
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (entry.isDirectory()) walk(path.join(dir, entry.name));
      else out.push(path.join(dir, entry.name));
    }
  };
  walk(env.storageDir());
  return out;
}

beforeAll(async () => {
  t = await makeTeam('pdfrace');
  studyId = (await t.coach.call(studies.POST, { json: { teamId: t.teamId, title: 'Raced PDF', year: 2022 } })).body
    .studies[0].id;
});

describe('concurrent PDF uploads to one study', () => {
  it('leave exactly the stored file on disk', async () => {
    const bytes = new TextEncoder().encode('%PDF-1.4\n% a tiny test PDF\n%%EOF\n');
    const results = await Promise.all(
      Array.from({ length: 6 }, () =>
        sendForm(t.coach, file.POST, {
          params: { id: String(studyId) },
          file: { name: 'paper.pdf', type: 'application/pdf', bytes },
        }),
      ),
    );
    expect(results.map((r) => r.status)).toEqual(Array(6).fill(200));
    const study = (await Study.findByPk(studyId))!;
    const files = storedFiles().filter((f) => f.includes(`${studyId}-`));
    expect(files).toHaveLength(1);
    expect(files[0].endsWith(path.basename(study.pdfKey!))).toBe(true);
  });
});
