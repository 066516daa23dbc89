import { beforeAll, describe, expect, it } from 'vitest';
import * as appraisals from '@/app/api/reviews/[id]/appraisals/route';
import * as studies from '@/app/api/studies/route';
import { copyMechanism } from '@/lib/reviews/copy-mechanism';
import { Appraisal, Mechanism } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, type TeamFixture } from '../reviews/helpers';
import { readyReview } from '../publishing/helpers';

useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('reuse');
});

describe('copying a mechanism from a past review', () => {
  it('copies the mechanism and its appraisals as new rows pointing at the same library studies', async () => {
    const past = await readyReview(t.coach, t.teamId, { claim: 'Past review: daily hangs stiffen tendons.' });
    const now = await readyReview(t.coach, t.teamId, { claim: 'New review: pinch lifts stiffen thumb tendons.' });
    const study = await t.coach.call(studies.POST, {
      json: {
        teamId: t.teamId,
        title: 'Tendon adaptation to daily isometric hangs',
        authors: [{ family: 'Holt', given: 'Mara' }],
        year: 2024,
        journal: 'Journal of Invented Training',
        doi: '10.5555/reuse.1',
        design: 'randomized',
      },
    });
    expect(study.status).toBe(201);
    const studyId = study.body.studies[0].id as number;
    const source = await Mechanism.findOne({ where: { reviewId: past.id, name: 'Tendon stiffness' } });
    const made = await t.coach.call(appraisals.POST, {
      params: { id: String(past.id) },
      json: { studyId, mechanismId: source!.id, direction: 'against', riskOfBias: 'serious', notes: 'Small sample.' },
    });
    expect(made.status).toBe(201);

    const before = await Appraisal.count({ where: { reviewId: past.id } });
    const result = await copyMechanism(source!.id, now.id);
    expect(result.appraisals).toBe(1);
    const copy = await Mechanism.findByPk(result.mechanismId);
    expect(copy!.get({ plain: true })).toMatchObject({ reviewId: now.id, name: 'Tendon stiffness', stated: false });
    const copied = await Appraisal.findAll({ where: { reviewId: now.id, mechanismId: copy!.id } });
    expect(copied).toHaveLength(1);
    const original = (await Appraisal.findByPk(made.body.appraisal.id))!.get({ plain: true });
    const { id: _a, reviewId: _b, mechanismId: _c, notes: _d, createdAt: _e, updatedAt: _f, ...judgement } = original;
    expect(judgement).toMatchObject({ studyId, direction: 'against' });
    expect(copied[0].get({ plain: true })).toMatchObject(judgement);
    expect(copied[0].notes).toMatch(/copied from/i);
    expect(copied[0].id).not.toBe(made.body.appraisal.id);
    // The past review is untouched.
    expect(await Appraisal.count({ where: { reviewId: past.id } })).toBe(before);
  });

  it('refuses a mechanism of another team as if it did not exist, and copying into its own review', async () => {
    const mine = await readyReview(t.coach, t.teamId, { claim: 'Mine: fingerboard ladders make pulleys stronger.' });
    const theirs = await readyReview(t.outsider, t.otherTeamId, {
      claim: 'Theirs: a claim from another team entirely.',
    });
    const theirMechanism = await Mechanism.findOne({ where: { reviewId: theirs.id } });
    await expect(copyMechanism(theirMechanism!.id, mine.id)).rejects.toMatchObject({ status: 404 });
    const own = await Mechanism.findOne({ where: { reviewId: mine.id } });
    await expect(copyMechanism(own!.id, mine.id)).rejects.toMatchObject({ status: 400 });
  });
});
