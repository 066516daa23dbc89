import type { MatchDTO } from '@/lib/publishing/types';

/**
 * `text` with the ranges fuse.js matched (for this field) marked. Ranges shorter than two
 * characters are left out: single letters matched by a fuzzy search are noise to a reader.
 */
export function Highlight({ text, field, matches }: { text: string; field: string; matches?: MatchDTO[] }) {
  const ranges = (matches ?? [])
    .filter((m) => m.key === field && m.value === text)
    .flatMap((m) => m.indices)
    .filter(([a, b]) => b - a >= 1)
    .sort((x, y) => x[0] - y[0]);
  if (!ranges.length) return <>{text}</>;
  const parts: React.ReactNode[] = [];
  let at = 0;
  for (const [start, end] of ranges) {
    if (start < at) continue;
    if (start > at) parts.push(text.slice(at, start));
    parts.push(
      <mark key={start} className="bg-rope-100 text-ink rounded-sm px-0.5">
        {text.slice(start, end + 1)}
      </mark>,
    );
    at = end + 1;
  }
  parts.push(text.slice(at));
  return <>{parts}</>;
}
