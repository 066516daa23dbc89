/**
 * Blind scoring over HTTP (docs/architecture.md, "Peer review"): while the demo reviewer has not
 * submitted in the open round, no GET route and no page tells them the engine's numbers or the
 * verdict of that review. The same detector is run as the owner on the same addresses, to show
 * it finds what is there to find. Run: npx tsx bench/probes/blind-reads.ts
 */
import { VERDICT_KEYS, VERDICT_LABEL } from '../../lib/scoring/constants';
import { ReadOnlyDb } from './lib/database';
import type { Answer } from './lib/http';
import { publish, table } from './lib/report';
import { endpoints, fill, queryFor } from './lib/routes';
import { startProduction } from '../lib/production';
import { buildWorld } from './lib/world';

interface Engine {
  reviewId: number;
  title: string;
  verdict: string;
  label: string;
  /** The outcome's probability as the app prints it (a share and a percentage). */
  printed: string[];
}

// The JSON names of the engine's outputs (lib/reviews/types.ts VerdictDTO, AppraisalDTO).
const ENGINE_KEYS =
  /"(probability|outcomeProbability|evidenceWeight|certainty|applicability|logOdds|robustness)"\s*:\s*(?!null)/;

/** Undo the escaping of the React payload inside a page, so its props read as JSON. */
const plain = (text: string) => text.replace(/\\"/g, '"');

/**
 * What the answer tells about the review: on an address of the review itself, any engine key, its
 * verdict or the printed probability; elsewhere, the verdict or an engine key in the stretch that
 * follows each mention of its title (its row in a list, its card, its search hit).
 */
function revealed(answer: Answer, url: string, engine: Engine): string | null {
  const text = plain(answer.text);
  const verdictMarks = [`"verdict":"${engine.verdict}"`, engine.label];
  const about = new RegExp(`/reviews/${engine.reviewId}(/|\\?|$)`).test(url);
  if (about) {
    const key = text.match(ENGINE_KEYS);
    if (key) return `engine field ${key[1]}`;
    const mark = [...verdictMarks, ...engine.printed].find((m) => text.includes(m));
    if (!mark) return null;
    const at = text.indexOf(mark);
    return `"${mark}" in …${text.slice(Math.max(0, at - 80), at + 40).replace(/\s+/g, ' ')}…`;
  }
  for (let at = text.indexOf(engine.title); at >= 0; at = text.indexOf(engine.title, at + 1)) {
    const stretch = text.slice(at, at + 600);
    const mark = verdictMarks.find((m) => stretch.includes(m)) ?? stretch.match(ENGINE_KEYS)?.[1];
    if (mark) return `"${mark}" beside its title`;
  }
  return null;
}

async function main() {
  const app = await startProduction();
  const db = await ReadOnlyDb.open(app.databaseFile);
  try {
    const world = await buildWorld(app, db);
    const team = world.demo;
    const [owner, , reviewer] = team.members;
    const reviewId = Number(team.params.id[0]);
    if (!team.invited.has(reviewer.actor!.userId) || team.submitted.has(reviewer.actor!.userId)) {
      throw new Error('the demo reviewer is expected invited and not submitted in the open round');
    }
    const verdict = await owner.caller.ok<{ verdict: string; outcome: { probability: number } }>(
      'GET',
      `/api/reviews/${reviewId}/verdict`,
    );
    const review = await db.first<{ title: string }>('SELECT title FROM reviews WHERE id = ?', [reviewId]);
    const p: number = verdict.outcome.probability;
    // The coach's priors are inputs every reviewer sees; a percentage equal to one says nothing.
    const priors = await db.all<{ prior: number }>('SELECT prior FROM mechanisms WHERE "reviewId" = ?', [reviewId]);
    const inputs = new Set(priors.map((m) => Math.round(m.prior * 100)));
    const percent = Math.round(p * 100);
    const engine: Engine = {
      reviewId,
      title: review!.title,
      verdict: verdict.verdict,
      label: VERDICT_LABEL[verdict.verdict as keyof typeof VERDICT_LABEL],
      printed: [p.toFixed(2), p.toFixed(3), ...(inputs.has(percent) ? [] : [`${percent}%`, `${percent} %`])],
    };

    const rows: string[][] = [];
    const leaks: string[] = [];
    let ownerSees = 0;
    let requests = 0;
    // Every GET route and page with the team's ids, then searches that find the review by a word
    // of its title, with each verdict filter (a filter that matched it would tell its verdict).
    const word = encodeURIComponent(engine.title.split(' ').find((w) => w.length > 5) ?? engine.title);
    const addresses = endpoints()
      .filter((x) => x.method === 'GET')
      .flatMap((e) =>
        fill(e.template, team.params).map((path) => ({
          kind: e.kind,
          url: path + queryFor(e.template, team.teamId, team.params.mechanismId[0]),
        })),
      );
    addresses.push({ kind: 'page', url: `/search?q=${word}` });
    for (const v of ['', ...VERDICT_KEYS]) {
      addresses.push({ kind: 'api', url: `/api/search?teamId=${team.teamId}&q=${word}${v ? `&verdict=${v}` : ''}` });
    }
    for (const { kind, url } of addresses) {
      const mine = await reviewer.caller.send('GET', url);
      const theirs = await owner.caller.send('GET', url);
      requests += 2;
      let leak = revealed(mine, url, engine);
      const hits = (mine.json as { results?: { kind: string; id: number }[] } | null)?.results ?? [];
      if (url.includes('verdict=') && hits.some((r) => r.kind === 'review' && r.id === reviewId))
        leak = 'the verdict filter matches it';
      const found = (theirs.json as { results?: { kind: string; id: number }[] } | null)?.results ?? [];
      const control =
        revealed(theirs, url, engine) ??
        (url.includes(`verdict=${engine.verdict}`) && found.some((r) => r.kind === 'review' && r.id === reviewId)
          ? 'its verdict filter matches it'
          : null);
      if (leak) leaks.push(`${url} → ${leak}`);
      if (control) ownerSees++;
      rows.push([kind, url, String(mine.status), leak ? `LEAK ${leak}` : '-', String(theirs.status), control ?? '-']);
    }

    const summary = [
      `review ${reviewId} "${engine.title}", verdict ${engine.verdict}, P(outcome) ${p.toFixed(3)}; reviewer invited, not submitted`,
      `GET addresses (routes, pages, searches): ${rows.length}, requests: ${requests}`,
      `looked for: engine fields, "verdict":"${engine.verdict}", "${engine.label}", ${engine.printed.map((s) => `"${s}"`).join(', ')} (a percentage equal to a prior the reviewer is shown is not looked for)`,
      `answers to the reviewer revealing the engine's numbers or verdict: ${leaks.length}`,
      ...leaks.map((l) => `  LEAK ${l}`),
      `control: addresses where the same detector finds them for the owner: ${ownerSees}`,
    ].join('\n');
    publish(
      'blind-reads',
      `${summary}\n\n${table(['kind', 'address', 'reviewer', 'reveals', 'owner', 'owner sees'], rows)}`,
    );
    process.exitCode = leaks.length || ownerSees === 0 ? 1 : 0;
  } finally {
    await db.close();
    await app.stop();
  }
}

void main();
