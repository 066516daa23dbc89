import { useId } from 'react';
import { percent } from '@/components/review/labels';
import type { LeaveOneOutDTO, VerdictKey } from '@/lib/reviews/types';
import { VERDICT_LABEL, VERDICT_THRESHOLDS } from '@/lib/scoring/constants';

/**
 * The claimed outcome's probability with each study left out, one dot per study against the
 * 0.33 and 0.66 lines where the verdict table turns (docs/scoring.md §5, §9). Plain SVG, no chart
 * library. A dot whose verdict changes is a hollow diamond, not only another colour; each row
 * can be reached with the keyboard and reads out its numbers; the same numbers are in the table
 * below the chart.
 */

const ROW = 22;
const TOP = 26;
const LABEL = 138;
const PLOT = 172;
const RIGHT = 20;
const WIDTH = LABEL + PLOT + RIGHT;
const x = (p: number) => LABEL + Math.max(0, Math.min(1, p)) * PLOT;
const shorten = (text: string, max = 20) => (text.length > max ? `${text.slice(0, max - 1)}…` : text);

export function LeaveOneOutChart({
  rows,
  outcomeProbability,
  verdict,
}: {
  rows: readonly LeaveOneOutDTO[];
  outcomeProbability: number;
  verdict: VerdictKey;
}) {
  const titleId = useId();
  const descId = useId();
  const height = TOP + (rows.length + 1) * ROW + 8;
  const lines = [VERDICT_THRESHOLDS.notSupportedBelow, VERDICT_THRESHOLDS.uncertainBelow];
  const changed = rows.filter((r) => r.changed).length;
  const all = [
    { key: 'all', label: 'All studies', probability: outcomeProbability, verdict, changed: false, whole: true },
    ...rows.map((r) => ({
      key: String(r.studyId),
      label: r.citation,
      probability: r.outcomeProbability,
      verdict: r.verdict,
      changed: r.changed,
      whole: false,
    })),
  ];

  return (
    <figure className="space-y-2" data-testid="leave-one-out-chart">
      <svg
        role="group"
        aria-labelledby={titleId}
        aria-describedby={descId}
        viewBox={`0 0 ${WIDTH} ${height}`}
        className="w-full max-w-md"
        style={{ height: 'auto' }}
      >
        <title id={titleId}>The claimed outcome’s probability with each study left out</title>
        <desc id={descId}>
          {`With all studies ${percent(outcomeProbability)}. ${rows.length} studies; leaving out ${changed} of them changes the verdict. Lines at 33 % and 66 % mark where the verdict turns.`}
        </desc>
        {/* The three zones of the verdict table, lightly, and their edges as dashed lines. */}
        <rect x={x(0)} y={TOP - 6} width={x(lines[0]) - x(0)} height={height - TOP} className="fill-danger-50" />
        <rect
          x={x(lines[0])}
          y={TOP - 6}
          width={x(lines[1]) - x(lines[0])}
          height={height - TOP}
          className="fill-warning-50"
        />
        <rect
          x={x(lines[1])}
          y={TOP - 6}
          width={x(1) - x(lines[1])}
          height={height - TOP}
          className="fill-success-50"
        />
        {[0, ...lines, 1].map((p) => (
          <g key={p} aria-hidden="true">
            <line
              x1={x(p)}
              x2={x(p)}
              y1={TOP - 6}
              y2={height - 2}
              className={p === 0 || p === 1 ? 'stroke-chalk-300' : 'stroke-chalk-600'}
              strokeDasharray={p === 0 || p === 1 ? undefined : '3 3'}
            />
            <text x={x(p)} y={TOP - 12} textAnchor="middle" className="fill-chalk-700 text-[10px]">
              {percent(p)}
            </text>
          </g>
        ))}
        <text x={LABEL - 18} y={TOP - 12} textAnchor="end" className="fill-chalk-700 text-[10px]" aria-hidden="true">
          Left out
        </text>
        {all.map((row, i) => {
          const y = TOP + i * ROW + ROW / 2;
          const cx = x(row.probability);
          const name = `${row.whole ? row.label : `Without ${row.label}`}: ${percent(row.probability)}, ${row.whole ? '' : row.changed ? 'the verdict changes to ' : 'still '}${VERDICT_LABEL[row.verdict]}`;
          return (
            <g
              key={row.key}
              tabIndex={0}
              role="img"
              aria-label={name}
              className="group outline-none"
              data-changed={row.changed || undefined}
            >
              <title>{name}</title>
              <rect
                x={1}
                y={y - ROW / 2 + 1}
                width={WIDTH - 2}
                height={ROW - 2}
                rx={4}
                className="stroke-rope-500 fill-transparent opacity-0 group-hover:opacity-100 group-focus:opacity-100"
                strokeWidth={2}
              />
              <text
                x={LABEL - 8}
                y={y + 4}
                textAnchor="end"
                className={row.whole ? 'fill-chalk-900 text-[11px] font-semibold' : 'fill-chalk-800 text-[11px]'}
              >
                {shorten(row.label)}
              </text>
              <line x1={x(0)} x2={x(1)} y1={y} y2={y} className="stroke-chalk-200" aria-hidden="true" />
              {row.changed ? (
                <path
                  d={`M ${cx} ${y - 6} L ${cx + 6} ${y} L ${cx} ${y + 6} L ${cx - 6} ${y} Z`}
                  className="fill-paper-raised stroke-danger-700"
                  strokeWidth={2}
                />
              ) : (
                <circle
                  cx={cx}
                  cy={y}
                  r={row.whole ? 5.5 : 4.5}
                  className={row.whole ? 'fill-granite-800' : 'fill-granite-600'}
                />
              )}
            </g>
          );
        })}
      </svg>
      <figcaption className="text-ink-muted flex flex-wrap gap-x-4 gap-y-1 text-xs">
        <span>
          <span aria-hidden="true" className="text-granite-600">
            ●
          </span>{' '}
          verdict unchanged
        </span>
        <span>
          <span aria-hidden="true" className="text-danger-700">
            ◇
          </span>{' '}
          verdict changes without that study
        </span>
        <span>dashed lines: 33 % and 66 %, where the verdict turns</span>
      </figcaption>
      <details className="text-sm">
        <summary className="text-brand cursor-pointer font-semibold">The chart as a table</summary>
        <table className="mt-2 w-full text-left text-xs">
          <thead>
            <tr className="border-line border-b">
              <th scope="col" className="py-1 pr-2 font-semibold">
                Left out
              </th>
              <th scope="col" className="py-1 pr-2 text-right font-semibold">
                Outcome
              </th>
              <th scope="col" className="py-1 font-semibold">
                Verdict
              </th>
            </tr>
          </thead>
          <tbody>
            {all.map((row) => (
              <tr key={row.key} className="border-line border-b last:border-b-0">
                <th scope="row" className="py-1 pr-2 font-normal">
                  {row.whole ? 'Nothing (all studies)' : row.label}
                </th>
                <td className="py-1 pr-2 text-right tabular-nums">{percent(row.probability)}</td>
                <td className="py-1">
                  {VERDICT_LABEL[row.verdict]}
                  {row.changed && <strong> (changes)</strong>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </figure>
  );
}
