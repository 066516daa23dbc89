import { beforeAll, describe, expect, inject, it } from 'vitest';

// Every documented GET route, with its query parameters, against the production build that the
// browser tests serve: code paths that only break in `next build` output (a model's class name
// minified inside raw SQL, for one) answer 500 here and nowhere else.
const baseURL = inject('baseURL');
let cookie = '';
let teamId = 0;
let reviewId = 0;
let studyId = 0;
let tag = '';

async function get(path: string, withCookie = true) {
  return fetch(`${baseURL}${path}`, {
    headers: { ...(withCookie ? { cookie } : {}), 'x-forwarded-for': '10.250.0.1' },
    redirect: 'manual',
  });
}

beforeAll(async () => {
  const res = await fetch(`${baseURL}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-forwarded-for': '10.250.0.1' },
    body: JSON.stringify({ email: 'owner@granite-hollow.test', password: 'loadbearing-demo' }),
  });
  expect(res.status).toBe(200);
  cookie = res.headers.getSetCookie()[0].split(';')[0];
  const me = await (await get('/api/me')).json();
  teamId = me.teams[0].id;
  const reviews = await (await get(`/api/reviews?teamId=${teamId}`)).json();
  reviewId = reviews.reviews[0].id;
  const studies = await (await get(`/api/studies?teamId=${teamId}`)).json();
  studyId = studies.studies[0].id;
  tag = studies.studies.flatMap((s: { tags: string[] }) => s.tags)[0] ?? 'fingers';
});

describe('documented GET routes on the production server', () => {
  const routes = () => [
    '/api/me',
    `/api/teams/${teamId}/members`,
    `/api/reviews?teamId=${teamId}`,
    `/api/reviews?teamId=${teamId}&status=published&verdict=supported&tag=${encodeURIComponent(tag)}`,
    `/api/reviews/${reviewId}`,
    `/api/reviews/${reviewId}/verdict`,
    `/api/reviews/${reviewId}/meta-analysis?mechanism=outcome`,
    `/api/reviews/${reviewId}/rounds`,
    `/api/reviews/${reviewId}/comments`,
    `/api/studies?teamId=${teamId}`,
    `/api/studies?teamId=${teamId}&q=grip`,
    `/api/studies?teamId=${teamId}&tag=${encodeURIComponent(tag)}`,
    `/api/studies?teamId=${teamId}&q=a&tag=${encodeURIComponent(tag)}&sort=-year&design=randomized&page=1&pageSize=10`,
    `/api/studies/${studyId}`,
    ...['apa', 'bibtex', 'ris', 'csl'].map((f) => `/api/studies/${studyId}/citation?format=${f}`),
    '/api/verdicts',
    '/api/verdicts?q=hang',
    `/api/search?q=hang&teamId=${teamId}`,
    `/api/search?q=hang&kind=review&verdict=supported&status=published&tag=${encodeURIComponent(tag)}&limit=5`,
    '/feed.xml',
    '/dashboard',
    '/reviews',
    `/reviews/${reviewId}`,
    `/reviews/${reviewId}/rounds`,
    '/library',
    `/library?q=grip&tag=${encodeURIComponent(tag)}&sort=-year`,
    `/library/${studyId}`,
    '/search?q=hang',
    '/team',
    '/verdicts',
  ];

  it('answers every one signed in without a server error', async () => {
    const failures: string[] = [];
    for (const path of routes()) {
      const res = await get(path);
      // A 400 can be the data's (a review another journey left without studies has no meta-analysis).
      if (res.status >= 500 || res.status === 404) failures.push(`${path} → ${res.status}`);
    }
    expect(failures).toEqual([]);
  });

  it('answers every one signed out with 401, a redirect or a page, never a server error', async () => {
    for (const path of routes()) {
      expect((await get(path, false)).status, path).toBeLessThan(500);
    }
  });
});
