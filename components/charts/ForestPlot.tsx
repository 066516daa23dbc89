'use client';

import { useEffect, useId, useRef, useState } from 'react';
import { formatNumber } from '@/lib/scoring/format';
import { measureWords } from './heterogeneity';

export interface ForestRow {
  id: string | number;
  label: string;
  effectSize: number;
  ciLow: number;
  ciHigh: number;
  /** Share of the total weight, 0…100. */
  weight: number;
}

export interface ForestPooled {
  label: string;
  estimate: number;
  ciLow: number;
  ciHigh: number;
}

/** About five round ticks (steps of 1, 2 or 5 × 10^k) covering [lo, hi]. */
function ticks(lo: number, hi: number): number[] {
  const span = hi - lo || 1;
  const raw = span / 5;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => span / s <= 6) ?? 10 * magnitude;
  const out: number[] = [];
  for (let t = Math.ceil(lo / step) * step; t <= hi + step * 1e-9; t += step)
    out.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return out;
}

const ROW = 30;
const TOP = 34;
const num = (x: number) => formatNumber(x, 2);

/**
 * A forest plot drawn in SVG: one row per study (a square whose area follows its weight and a
 * whisker for its 95 % CI), the pooled random-effects diamond, the 95 % prediction interval when
 * there is one, and a line at zero (no effect). It measures its own width so labels stay readable
 * on a phone instead of shrinking with a fixed viewBox; the numbers are also in a table beside it.
 */
export function ForestPlot({
  rows,
  pooled,
  predictionInterval,
  measure,
  axisLabel,
  sides,
  title,
}: {
  rows: readonly ForestRow[];
  pooled: ForestPooled | null;
  predictionInterval?: [number, number] | null;
  measure: string;
  /** Overrides the axis title derived from `measure`. */
  axisLabel?: string;
  /** Words under each end of the axis, e.g. which side is the claimed effect. */
  sides?: { left: string; right: string };
  title: string;
}) {
  const holder = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(640);
  const titleId = useId();
  const descId = useId();

  useEffect(() => {
    const element = holder.current;
    if (!element) return;
    const observer = new ResizeObserver(([entry]) => setWidth(Math.max(280, Math.round(entry.contentRect.width))));
    observer.observe(element);
    return () => observer.disconnect();
  }, []);

  const narrow = width < 520;
  const labelWidth = narrow ? 104 : 170;
  const numbersWidth = narrow ? 0 : 150;
  const plotLeft = labelWidth + 8;
  const plotRight = width - numbersWidth - 12;

  const values = [0, ...rows.flatMap((r) => [r.ciLow, r.ciHigh])];
  if (pooled) values.push(pooled.ciLow, pooled.ciHigh);
  const finite = values.filter(Number.isFinite);
  let lo = Math.min(...finite);
  let hi = Math.max(...finite);
  // With few studies the prediction interval can be many times wider than every CI (t with
  // k − 2 df); scaling the axis to it would squash the studies into a few pixels. Widen for it
  // only while it stays within twice the studies' span; beyond that it is clipped with arrows
  // (its numbers are printed in full beside it and in the text below).
  if (predictionInterval) {
    const span = hi - lo || 1;
    const [piLo, piHi] = predictionInterval;
    lo = Math.min(lo, Math.max(piLo, lo - span / 2));
    hi = Math.max(hi, Math.min(piHi, hi + span / 2));
  }
  const pad = (hi - lo || 1) * 0.06;
  lo -= pad;
  hi += pad;
  const x = (v: number) => plotLeft + ((v - lo) / (hi - lo)) * (plotRight - plotLeft);

  const maxWeight = Math.max(1e-9, ...rows.map((r) => r.weight));
  const side = (w: number) => 5 + 11 * Math.sqrt(Math.max(0, w) / maxWeight);

  const pooledY = TOP + rows.length * ROW + ROW * 0.9;
  const piY = pooledY + ROW * 0.9;
  const axisY = (predictionInterval ? piY : pooledY) + ROW * 0.8;
  const height = axisY + (sides ? 58 : 44);
  const axisTicks = ticks(lo, hi);
  const fullAxis = axisLabel ?? measureWords(measure).axis;
  // On a phone the axis title keeps its first words only; the full label is in the text below.
  const axis = narrow ? fullAxis.replace(/\s*\(.*$/, '') : fullAxis;

  const description =
    `${rows.length} studies. ` +
    rows
      .map(
        (r) =>
          `${r.label}: ${num(r.effectSize)} (95 % CI ${num(r.ciLow)} to ${num(r.ciHigh)}), weight ${num(r.weight)} %.`,
      )
      .join(' ') +
    (pooled ? ` Pooled: ${num(pooled.estimate)} (95 % CI ${num(pooled.ciLow)} to ${num(pooled.ciHigh)}).` : '') +
    (predictionInterval
      ? ` 95 % prediction interval ${num(predictionInterval[0])} to ${num(predictionInterval[1])}.`
      : '');

  return (
    <div ref={holder} className="w-full" data-testid="forest-plot">
      <svg
        width={width}
        height={height}
        viewBox={`0 0 ${width} ${height}`}
        role="img"
        aria-labelledby={`${titleId} ${descId}`}
        className="text-ink block max-w-full"
      >
        <title id={titleId}>{title}</title>
        <desc id={descId}>{description}</desc>

        {/* Column heads */}
        <text x={0} y={16} className="fill-ink-muted text-[11px] font-semibold">
          Study
        </text>
        {!narrow && (
          <text x={width - 4} y={16} textAnchor="end" className="fill-ink-muted text-[11px] font-semibold">
            Effect [95 % CI] · weight
          </text>
        )}

        {/* No-effect line */}
        <line x1={x(0)} x2={x(0)} y1={TOP - 8} y2={axisY} className="stroke-chalk-500" strokeDasharray="3 3" />

        {rows.map((r, i) => {
          const y = TOP + i * ROW + ROW / 2;
          const s = side(r.weight);
          const lowClipped = r.ciLow < lo;
          const highClipped = r.ciHigh > hi;
          return (
            <g key={r.id} data-testid="forest-row">
              <text x={0} y={y + 4} className="fill-ink text-[12px]">
                {r.label.length > (narrow ? 14 : 26) ? `${r.label.slice(0, narrow ? 13 : 25)}…` : r.label}
              </text>
              <line
                x1={x(Math.max(lo, r.ciLow))}
                x2={x(Math.min(hi, r.ciHigh))}
                y1={y}
                y2={y}
                className="stroke-ink"
                strokeWidth={1.5}
              />
              {!lowClipped && (
                <line x1={x(r.ciLow)} x2={x(r.ciLow)} y1={y - 4} y2={y + 4} className="stroke-ink" strokeWidth={1.5} />
              )}
              {!highClipped && (
                <line
                  x1={x(r.ciHigh)}
                  x2={x(r.ciHigh)}
                  y1={y - 4}
                  y2={y + 4}
                  className="stroke-ink"
                  strokeWidth={1.5}
                />
              )}
              <rect x={x(r.effectSize) - s / 2} y={y - s / 2} width={s} height={s} className="fill-granite-700" />
              {!narrow && (
                <text x={width - 4} y={y + 4} textAnchor="end" className="fill-ink-muted text-[11px] tabular-nums">
                  {num(r.effectSize)} [{num(r.ciLow)}, {num(r.ciHigh)}] · {num(r.weight)} %
                </text>
              )}
            </g>
          );
        })}

        <line
          x1={0}
          x2={width}
          y1={TOP + rows.length * ROW + 4}
          y2={TOP + rows.length * ROW + 4}
          className="stroke-line"
        />

        {pooled && (
          <g data-testid="forest-pooled">
            <text x={0} y={pooledY + 4} className="fill-ink text-[12px] font-semibold">
              {pooled.label}
            </text>
            <polygon
              points={`${x(pooled.ciLow)},${pooledY} ${x(pooled.estimate)},${pooledY - 8} ${x(pooled.ciHigh)},${pooledY} ${x(pooled.estimate)},${pooledY + 8}`}
              className="fill-rope-500 stroke-rope-700"
            />
            {!narrow && (
              <text
                x={width - 4}
                y={pooledY + 4}
                textAnchor="end"
                className="fill-ink text-[11px] font-semibold tabular-nums"
              >
                {num(pooled.estimate)} [{num(pooled.ciLow)}, {num(pooled.ciHigh)}]
              </text>
            )}
          </g>
        )}

        {predictionInterval && (
          <g data-testid="forest-prediction">
            <text x={0} y={piY + 4} className="fill-ink-muted text-[11px]">
              {narrow ? 'Prediction int.' : 'Prediction interval'}
            </text>
            <line
              x1={x(Math.max(lo, predictionInterval[0]))}
              x2={x(Math.min(hi, predictionInterval[1]))}
              y1={piY}
              y2={piY}
              className="stroke-rope-700"
              strokeWidth={2}
              strokeDasharray="6 3"
            />
            {predictionInterval[0] < lo ? (
              <path
                d={`M${x(lo) + 7},${piY - 5} L${x(lo)},${piY} L${x(lo) + 7},${piY + 5}`}
                className="stroke-rope-700 fill-none"
                strokeWidth={2}
              />
            ) : (
              <line
                x1={x(predictionInterval[0])}
                x2={x(predictionInterval[0])}
                y1={piY - 5}
                y2={piY + 5}
                className="stroke-rope-700"
                strokeWidth={2}
              />
            )}
            {predictionInterval[1] > hi ? (
              <path
                d={`M${x(hi) - 7},${piY - 5} L${x(hi)},${piY} L${x(hi) - 7},${piY + 5}`}
                className="stroke-rope-700 fill-none"
                strokeWidth={2}
              />
            ) : (
              <line
                x1={x(predictionInterval[1])}
                x2={x(predictionInterval[1])}
                y1={piY - 5}
                y2={piY + 5}
                className="stroke-rope-700"
                strokeWidth={2}
              />
            )}
            {!narrow && (
              <text x={width - 4} y={piY + 4} textAnchor="end" className="fill-ink-muted text-[11px] tabular-nums">
                [{num(predictionInterval[0])}, {num(predictionInterval[1])}]
              </text>
            )}
          </g>
        )}

        {/* Axis */}
        <line x1={plotLeft} x2={plotRight} y1={axisY} y2={axisY} className="stroke-ink" />
        {axisTicks.map((t) => (
          <g key={t}>
            <line x1={x(t)} x2={x(t)} y1={axisY} y2={axisY + 5} className="stroke-ink" />
            <text x={x(t)} y={axisY + 17} textAnchor="middle" className="fill-ink-muted text-[11px] tabular-nums">
              {formatNumber(t, 2)}
            </text>
          </g>
        ))}
        <text x={(plotLeft + plotRight) / 2} y={axisY + 36} textAnchor="middle" className="fill-ink-muted text-[11px]">
          {axis}
        </text>
        {sides && (
          <g className="fill-ink text-[11px] font-semibold" data-testid="forest-sides">
            <text x={plotLeft} y={axisY + 52} textAnchor="start">
              ← {sides.left}
            </text>
            <text x={plotRight} y={axisY + 52} textAnchor="end">
              {sides.right} →
            </text>
          </g>
        )}
      </svg>
    </div>
  );
}
