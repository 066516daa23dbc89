import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { doiUrl, lookupDoi, normalizeDoi } from '@/lib/citations/doi';
import { startFakeDoiServer, type FakeDoiServer } from '@/lib/citations/fake-doi-server';
import { lowerHyphenatedParts } from '@/lib/citations/parse';

describe('normalizeDoi', () => {
  it('takes the forms people paste and lower-cases ASCII letters (DOI Handbook ch. 2: case-insensitive under ASCII case folding)', () => {
    expect(normalizeDoi('10.5555/HJTS.2024.0312')).toBe('10.5555/hjts.2024.0312');
    expect(normalizeDoi('https://doi.org/10.5555/abc')).toBe('10.5555/abc');
    expect(normalizeDoi('http://dx.doi.org/10.5555/abc')).toBe('10.5555/abc');
    expect(normalizeDoi('doi: 10.5555/abc.')).toBe('10.5555/abc');
    expect(normalizeDoi('https://doi.org/10.1002%2F%28SICI%291097-4571')).toBe('10.1002/(sici)1097-4571');
    // Non-ASCII letters keep their case (the Handbook's folding is ASCII only).
    expect(normalizeDoi('10.5555/Ärm')).toBe('10.5555/Ärm');
  });

  it('refuses what is not a DOI', () => {
    for (const text of [
      '',
      'hello',
      '10.55/abc',
      '11.5555/abc',
      '10.5555',
      '10.5555/has space',
      'https://example.test/10.5555/x',
    ]) {
      expect(normalizeDoi(text), text).toBeNull();
    }
  });

  it('builds the resolver URL with each segment encoded', () => {
    expect(doiUrl('10.5555/a<b>#c', 'https://doi.org/')).toBe('https://doi.org/10.5555/a%3Cb%3E%23c');
  });
});

describe('lookupDoi against the local fake of the DOI service', () => {
  let fake: FakeDoiServer;
  beforeAll(async () => {
    fake = await startFakeDoiServer();
  });
  afterAll(() => fake.close());

  it('returns the CSL-JSON of a demo DOI, asking for application/vnd.citationstyles.csl+json', async () => {
    const seen: string[] = [];
    const spy: typeof fetch = async (input, init) => {
      seen.push(new Headers(init?.headers).get('accept')!);
      return fetch(input, init);
    };
    const res = await lookupDoi('10.5555/hjts.2021.0207', { baseUrl: fake.url, fetch: spy });
    expect(res.ok).toBe(true);
    expect(res.ok && res.csl.title).toBe(
      'Heavy slow isometric loading increases finger flexor tendon stiffness in trained climbers',
    );
    expect(seen).toEqual(['application/vnd.citationstyles.csl+json']);
  });

  it('fails with a sentence, never an exception: unknown (404), unavailable (503), untitled, unreachable, too slow', async () => {
    expect(await lookupDoi('10.5555/nothing-here', { baseUrl: fake.url })).toEqual({
      ok: false,
      reason: 'No record found for DOI 10.5555/nothing-here; check it for typos.',
    });
    expect(await lookupDoi('10.5555/fake.unavailable', { baseUrl: fake.url })).toMatchObject({
      ok: false,
      reason: expect.stringMatching(/answered 503/),
    });
    expect(await lookupDoi('10.5555/fake.untitled', { baseUrl: fake.url })).toMatchObject({
      ok: false,
      reason: expect.stringMatching(/no title/),
    });
    expect(await lookupDoi('10.5555/x', { baseUrl: 'http://127.0.0.1:1' })).toMatchObject({
      ok: false,
      reason: expect.stringMatching(/Could not reach/),
    });
    const slow: typeof fetch = (_input, init) =>
      new Promise((_resolve, reject) => init?.signal?.addEventListener('abort', () => reject(init.signal!.reason)));
    expect(await lookupDoi('10.5555/x', { baseUrl: fake.url, fetch: slow, timeoutMs: 50 })).toMatchObject({
      ok: false,
      reason: expect.stringMatching(/did not answer .* in time/),
    });
    const garbage: typeof fetch = async () => new Response('<html>not json</html>', { status: 200 });
    expect(await lookupDoi('10.5555/x', { baseUrl: fake.url, fetch: garbage })).toMatchObject({
      ok: false,
      reason: expect.stringMatching(/readable reference/),
    });
  });
});

describe('sentence case of BibTeX titles (APA 7th ed., ch. 6)', () => {
  it('lower-cases both halves of a hyphenated compound except at the start of the title or a subtitle', () => {
    expect(
      lowerHyphenatedParts(
        'Cold-Water immersion and Twelve-Week gains: Low-Load work',
        'Cold-Water Immersion and Twelve-Week Gains: Low-Load Work',
      ),
    ).toBe('Cold-water immersion and twelve-week gains: Low-load work');
  });

  it('keeps compounds the BibTeX protected with braces, and acronyms', () => {
    expect(
      lowerHyphenatedParts(
        'Training with the Hollow-Ridge protocol and MVC-Based loads',
        'Training with the {Hollow-Ridge} Protocol and MVC-Based Loads',
      ),
    ).toBe('Training with the Hollow-Ridge protocol and MVC-Based loads');
  });
});
