/**
 * Every route × {owner, coach, reviewer, athlete, other team, signed out} of both teams, over
 * HTTP against the production build: counts leaks (docs/architecture.md, "How we probe it").
 * Reads are sent by everyone; a write is sent only by those the policy refuses (with a well-formed
 * body, bench/probes/lib/bodies.ts), since
 * an allowed write would change the data the next requests read — bench/probes/fuzz.ts covers
 * allowed writes with malformed bodies. Run: npx tsx bench/probes/access-matrix.ts
 */
import { wellFormed } from './lib/bodies';
import { changedTables, ReadOnlyDb } from './lib/database';
import { expectation, leakIn, refused, stricterThanPolicy } from './lib/leaks';
import { publish, table } from './lib/report';
import { endpoints, fill, isTeamScoped, queryFor } from './lib/routes';
import { startProduction } from '../lib/production';
import { buildWorld, type ProbeActor } from './lib/world';

// Routes whose capability is not a team role: an account's own session and sign-up, a link's token,
// following a team with a public verdict. Their answers are still read for leaks by fuzz.ts's runs.
const NOT_TEAM_WRITES = /^\/api\/(auth\/|invitations\/\[token\]\/accept|teams\/\[teamId\]\/follow)/;

async function main() {
  const app = await startProduction();
  const db = await ReadOnlyDb.open(app.databaseFile);
  try {
    const world = await buildWorld(app, db);
    const before = await db.snapshot();
    const rows: (string | number)[][] = [];
    const leaks: string[] = [];
    const stricter: string[] = [];
    const fiveHundreds: string[] = [];
    let checked = 0;
    let skipped = 0;
    const routes = endpoints();

    for (const team of [world.demo, world.other]) {
      const outsiders = team === world.demo ? world.other.members.slice(0, 1) : world.demo.members;
      const actors: { column: string; who: ProbeActor }[] = [
        ...team.members.map((who) => ({ column: who.label.replace(/^(demo|other) /, ''), who })),
        ...outsiders.map((who) => ({ column: `outside:${who.label.replace(/^(demo|other) /, '')}`, who })),
        { column: 'signed out', who: world.signedOut },
      ];
      for (const e of routes) {
        if (e.method !== 'GET' && NOT_TEAM_WRITES.test(e.template)) continue;
        // A route with no id in it is the same for both teams: probed with the demo team's query only.
        if (team === world.other && !/\[/.test(e.template) && !queryFor(e.template, 0, 0)) continue;
        for (const path of fill(e.template, team.params)) {
          const url = e.method === 'GET' ? path + queryFor(e.template, team.teamId, team.params.mechanismId[0]) : path;
          const ids = Object.fromEntries(Object.entries(team.params).map(([k, v]) => [k, v[0]]));
          const cells: string[] = [];
          for (const { column, who } of actors) {
            const expected = expectation(e, who, team);
            if (e.method !== 'GET' && (expected === 'allow' || expected === 'open')) {
              cells.push(`${column}=skip`);
              skipped++;
              continue;
            }
            const answer = await who.caller.send(e.method, url, e.method === 'GET' ? {} : { json: wellFormed(e, ids) });
            checked++;
            const where = `${team.name}: ${e.method} ${url} as ${who.label}`;
            if (answer.status >= 500) fiveHundreds.push(`${where} → ${answer.status}`);
            const leak = leakIn(answer, e, who, team, world, expected);
            if (leak) leaks.push(`${where} → ${leak}`);
            if (stricterThanPolicy(answer, expected)) stricter.push(`${where} → ${answer.status}`);
            cells.push(
              `${column}=${answer.status}${answer.status === 200 && refused(answer) ? 'nf' : ''}${leak ? '!' : ''}`,
            );
          }
          rows.push([
            team.name,
            e.method,
            url,
            isTeamScoped(e) ? e.actions.join('+') || 'page' : 'open',
            cells.join(' '),
          ]);
        }
      }
    }
    const changed = changedTables(before, await db.snapshot());
    const summary = [
      `from the filesystem: ${routes.filter((e) => e.kind === 'api').length} API methods (${routes.filter((e) => e.kind === 'api' && e.method !== 'GET').length} writes) and ${routes.filter((e) => e.kind === 'page').length} pages; addresses with real ids: ${rows.length}; actors: 6 on the demo team's rows, 7 on the other team's`,
      `requests checked: ${checked}; allowed writes not sent: ${skipped}`,
      `leaks: ${leaks.length}`,
      ...leaks.map((l) => `  LEAK ${l}`),
      `5xx: ${fiveHundreds.length}`,
      ...fiveHundreds.map((l) => `  ${l}`),
      `rows changed by the refused writes: ${changed.length ? JSON.stringify(changed) : 0}`,
      `refused although the policy allows (blind scoring, no such row …): ${stricter.length}`,
      ...stricter.map((l) => `  ${l}`),
    ].join('\n');
    publish(
      'access-matrix',
      `${summary}\n\n${table(['rows of', 'method', 'path', 'policy', 'answers (nf = streamed not-found page, ! = leak)'], rows)}`,
    );
    process.exitCode = leaks.length || fiveHundreds.length || changed.length ? 1 : 0;
  } finally {
    await db.close();
    await app.stop();
  }
}

void main();
