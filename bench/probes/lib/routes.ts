import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import type { Action } from '../../../lib/auth/policy';

/**
 * Every route of the app, read from the filesystem: app/**\/route.ts with its exported methods
 * and the policy actions each method's block asks for, and every page (app/**\/page.tsx and the
 * Pages Router's pages/). Route groups `(…)` leave the URL.
 */
export interface Endpoint {
  kind: 'api' | 'page';
  method: string;
  /** e.g. /api/reviews/[id]/rounds/[roundId] */
  template: string;
  file: string;
  /** The policy actions this method's handler asks (`authorize('…')`); empty = not team-scoped. */
  actions: Action[];
  /** What the method reads from its body: JSON (a zod schema), a multipart upload, or nothing. */
  body: 'json' | 'multipart' | 'none';
}

const ROOT = process.cwd();
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? walk(full) : [full];
  });
}

function urlOf(relative: string): string {
  const parts = relative.split(path.sep).filter((p) => !/^\(.*\)$/.test(p));
  return '/' + parts.join('/');
}

export function endpoints(): Endpoint[] {
  const out: Endpoint[] = [];
  for (const file of walk(path.join(ROOT, 'app'))) {
    const rel = path.relative(path.join(ROOT, 'app'), file);
    if (path.basename(file) === 'route.ts') {
      const source = readFileSync(file, 'utf8');
      const template = urlOf(path.dirname(rel));
      // Each method's block runs from its `export const METHOD` to the next export.
      const blocks = source.split(/(?=^export const )/m);
      for (const method of METHODS) {
        const block = blocks.find((b) => b.startsWith(`export const ${method} `));
        if (!block) continue;
        const actions = [...block.matchAll(/authorize\('([a-z.]+)'/g)].map((m) => m[1] as Action);
        const body = /multipart:\s*true/.test(block) ? 'multipart' : /\bbody:\s*\w/.test(block) ? 'json' : 'none';
        out.push({ kind: 'api', method, template, file: path.relative(ROOT, file), actions, body });
      }
    } else if (path.basename(file) === 'page.tsx') {
      const template = urlOf(path.dirname(rel)).replace(/\/$/, '') || '/';
      // A page about one row answers not-found unless its first policy question is allowed.
      const gate = /\[(?!slug\]|token\]|number\])/.test(template)
        ? readFileSync(file, 'utf8').match(/decide\(\w+, '([a-z.]+)'/)?.[1]
        : undefined;
      const actions = gate ? [gate as Action] : [];
      out.push({ kind: 'page', method: 'GET', template, file: path.relative(ROOT, file), actions, body: 'none' });
    }
  }
  for (const file of walk(path.join(ROOT, 'pages'))) {
    const rel = path.relative(path.join(ROOT, 'pages'), file).replace(/\.tsx$/, '');
    // _app, _document, 500 are not addresses; signed-in.tsx is the same address with a session (proxy.ts).
    if (/(^|\/)_|^500$|signed-in$/.test(rel)) continue;
    const template = '/' + rel.replace(/\/?index$/, '');
    out.push({ kind: 'page', method: 'GET', template, file: path.relative(ROOT, file), actions: [], body: 'none' });
  }
  return out.sort((a, b) => a.template.localeCompare(b.template) || a.method.localeCompare(b.method));
}

/** `[id]` means a review under /reviews, a study under /studies and /library, a suggestion under /evidence-suggestions. */
function paramName(segments: string[], index: number): string {
  const name = segments[index].slice(1, -1);
  if (name !== 'id') return name;
  const before = segments[index - 1];
  if (before === 'studies' || before === 'library') return 'studyId';
  if (before === 'evidence-suggestions') return 'suggestionId';
  return 'id';
}

/** The concrete paths of a template with one team's ids (every combination of listed values). */
export function fill(template: string, params: Record<string, (string | number)[]>): string[] {
  const segments = template.split('/');
  let paths: string[][] = [[]];
  segments.forEach((segment, i) => {
    const values = /^\[.+\]$/.test(segment) ? (params[paramName(segments, i)] ?? ['999999']) : [segment];
    paths = paths.flatMap((p) => values.map((v) => [...p, String(v)]));
  });
  return paths.map((p) => p.join('/'));
}

/** The query a route needs to answer about one team (the rest are asked without one). */
export function queryFor(template: string, teamId: number, mechanismId: number | string): string {
  const q: Record<string, string> = {
    '/api/reviews': `teamId=${teamId}`,
    '/api/studies': `teamId=${teamId}`,
    '/api/search': `teamId=${teamId}&q=a`,
    '/api/verdicts': `teamId=${teamId}`,
    '/api/reviews/[id]/meta-analysis': `mechanism=${mechanismId}`,
    '/api/studies/[id]/citation': 'format=apa',
    '/v/[slug]/references': 'format=bibtex',
    '/search': 'q=a',
  };
  return q[template] ? `?${q[template]}` : '';
}

/**
 * Asks about one team's rows: an API method that consults the policy, or a page with a row id in
 * its address (gated by its first policy question). A verdict's slug (public or team-only: the words check tells them apart) and a
 * link's token (the link is the permission) are not.
 */
export const isTeamScoped = (e: Endpoint) => e.actions.length > 0;

/** Whoever holds the link may read what it is for (an invitation names its team and address). */
export const isLink = (e: Endpoint) => e.template.includes('[token]');
