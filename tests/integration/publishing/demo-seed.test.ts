import { beforeAll, describe, expect, it } from 'vitest';
import * as verdicts from '@/app/api/verdicts/route';
import * as feed from '@/app/feed.xml/route';
import { seed } from '@/db/migrate';
import { db } from '@/lib/db';
import { verdictPage } from '@/lib/publishing/queries';
import { Follow, User } from '@/models';
import { Client, useTestApp } from '../../helpers/app';

useTestApp();

beforeAll(async () => {
  await seed(db());
});

describe('demo seed: published verdicts and a follower', () => {
  it('publishes the cold-plunge verdict publicly at version 2 with a note, and the pull-up ladder for the team only', async () => {
    const cold = await verdictPage('cold-plunges-after-strength', null);
    expect(cold.visibility).toBe('public');
    expect(cold.versions.map((v) => v.number)).toEqual([2, 1]);
    expect(cold.version.changeNote).toMatch(/what to do instead/i);
    // Version 1 is kept as it was: without the advice added in version 2.
    const v1 = await verdictPage('cold-plunges-after-strength', null, 1);
    expect(v1.snapshot.recommendations.whatInstead).toBe('');
    expect(cold.snapshot.recommendations.whatInstead.length).toBeGreaterThan(10);
    expect(cold.snapshot.references.length).toBeGreaterThan(0);
    expect(cold.snapshot.references[0].doi).toMatch(/^10\.5555\//);

    await expect(verdictPage('weighted-pull-up-ladder', null)).rejects.toMatchObject({ status: 404 });
    const anon = await new Client('10.88.0.1').call(verdicts.GET, { path: '/api/verdicts' });
    expect(anon.body.verdicts.map((v: { slug: string }) => v.slug)).toEqual(['cold-plunges-after-strength']);
  });

  it('has the demo athlete following the team', async () => {
    const athlete = await User.findOne({ where: { email: 'athlete@granite-hollow.test' } });
    expect(await Follow.count({ where: { userId: athlete!.id } })).toBe(1);
  });

  it('lists the public verdict in the Atom feed, and answers 404 for an unknown team', async () => {
    const res = await feed.GET(new Request('http://app.test/feed.xml?team=granite-hollow'));
    expect(res.headers.get('content-type')).toContain('application/atom+xml');
    const xml = await res.text();
    expect(xml).toContain('<feed xmlns="http://www.w3.org/2005/Atom">');
    expect(xml).toContain('http://app.test/v/cold-plunges-after-strength');
    expect(xml).not.toContain('weighted-pull-up-ladder');
    expect(xml).toMatch(/stop on pain/i);
    expect((await feed.GET(new Request('http://app.test/feed.xml?team=no-such-team'))).status).toBe(404);
  });
});
