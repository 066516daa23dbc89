import { beforeAll, describe, expect, it } from 'vitest';
import * as reviews from '@/app/api/reviews/route';
import { Review } from '@/models';
import { useTestApp } from '../../helpers/app';
import { makeTeam, newReview, type TeamFixture } from '../reviews/helpers';

// Another site cannot act for a signed-in coach: its requests carry the coach's cookie, but also
// its own Origin / Sec-Fetch-Site, and cannot send application/json without a preflight.
useTestApp();
let t: TeamFixture;

beforeAll(async () => {
  t = await makeTeam('xs');
});

async function post(headers: Record<string, string>) {
  const req = new Request('http://app.test/api/reviews', {
    method: 'POST',
    headers: { cookie: t.coach.cookie, 'x-forwarded-for': t.coach.address, ...headers },
    body: JSON.stringify(newReview(t.teamId)),
  });
  return reviews.POST(req, { params: Promise.resolve({}) });
}

describe('cross-site requests', () => {
  it('refuses a POST from a foreign Origin with text/plain (a plain HTML form elsewhere)', async () => {
    const before = await Review.count();
    const res = await post({ origin: 'http://evil.test', 'content-type': 'text/plain' });
    expect(res.status).toBe(403);
    expect(await Review.count()).toBe(before);
  });

  it('refuses a foreign Origin even with application/json, and a cross-site Sec-Fetch-Site', async () => {
    expect((await post({ origin: 'http://evil.test', 'content-type': 'application/json' })).status).toBe(403);
    expect((await post({ 'sec-fetch-site': 'cross-site', 'content-type': 'application/json' })).status).toBe(403);
    expect((await post({ 'sec-fetch-site': 'same-site', 'content-type': 'application/json' })).status).toBe(403);
  });

  it('refuses a body that is not JSON even from our own origin (415)', async () => {
    expect((await post({ origin: 'http://app.test', 'content-type': 'text/plain' })).status).toBe(415);
  });

  it('lets our own pages through', async () => {
    const res = await post({
      origin: 'http://app.test',
      'sec-fetch-site': 'same-origin',
      'content-type': 'application/json',
    });
    expect(res.status).toBe(201);
  });
});
