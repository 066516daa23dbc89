import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// Every write path goes through one wrapper — route() for route handlers, formAction() for
// server actions (lib/auth/handler.ts, lib/auth/action.ts) — so none can skip the session, the
// schema, the policy, the freeze, the same-origin check or its write turn. Read from the source:
// a handler written as a bare function would compile and work, and skip them all.
const ROOT = path.resolve(__dirname, '../../..');

function files(dir: string, keep: (name: string) => boolean): string[] {
  return readdirSync(path.join(ROOT, dir), { recursive: true, encoding: 'utf8' })
    .filter((name) => keep(path.basename(name)))
    .map((name) => path.join(dir, name));
}

/** The names a module exports, each with the text that makes it. */
function exportsOf(file: string): Array<{ name: string; made: string }> {
  const text = readFileSync(path.join(ROOT, file), 'utf8');
  const found: Array<{ name: string; made: string }> = [];
  for (const match of text.matchAll(/^export\s+(?:async\s+)?(const|function)\s+(\w+)\s*(=\s*(\w+))?/gm)) {
    found.push({ name: match[2], made: match[1] === 'function' ? 'function' : (match[4] ?? '') });
  }
  return found;
}

describe('write paths', () => {
  it('every route handler is made by route()', () => {
    const handlers = files('app', (name) => name === 'route.ts').flatMap((file) =>
      exportsOf(file)
        .filter((e) => /^(GET|HEAD|POST|PUT|PATCH|DELETE)$/.test(e.name))
        .map((e) => `${file} ${e.name}: ${e.made}`),
    );
    expect(handlers.length).toBeGreaterThan(40);
    expect(handlers.filter((h) => !h.endsWith(': route'))).toEqual([]);
  });

  it('every server action is made by formAction()', () => {
    const modules = files('app', (name) => /\.tsx?$/.test(name)).filter((file) =>
      /^\s*['"]use server['"]/.test(readFileSync(path.join(ROOT, file), 'utf8')),
    );
    const actions = modules.flatMap((file) => exportsOf(file).map((e) => `${file} ${e.name}: ${e.made}`));
    expect(modules.length).toBeGreaterThanOrEqual(5);
    expect(actions.filter((a) => !a.endsWith(': formAction'))).toEqual([]);
  });
});
