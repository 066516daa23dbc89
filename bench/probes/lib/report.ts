import { execSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';

/** A plain-text table, columns padded to their widest cell. */
export function table(head: string[], rows: (string | number)[][]): string {
  const cells = [head, ...rows.map((r) => r.map(String))];
  const widths = head.map((_, i) => Math.max(...cells.map((r) => (r[i] ?? '').length)));
  const line = (r: string[]) =>
    r
      .map((c, i) => (c ?? '').padEnd(widths[i]))
      .join('  ')
      .trimEnd();
  return [line(head), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.slice(1).map(line)].join('\n');
}

/** Prints the report and writes it to bench/results/<name>.txt with the commit and the load average. */
export function publish(name: string, body: string): void {
  let commit = 'unknown';
  try {
    commit = execSync('git rev-parse --short HEAD', { encoding: 'utf8' }).trim();
  } catch {
    // not a git checkout
  }
  const header = `${name} — ${new Date().toISOString()}, commit ${commit}, load average ${loadavg()
    .map((l) => l.toFixed(2))
    .join(' ')}`;
  const text = `${header}\n\n${body}\n`;
  console.log(text);
  const dir = path.join(process.cwd(), 'bench/results');
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, `${name}.txt`), text);
}
