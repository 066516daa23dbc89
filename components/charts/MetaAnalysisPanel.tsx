'use client';

import { Button } from '@/components/ui/Button';
import { Skeleton } from '@/components/ui/Skeleton';
import { formatNumber } from '@/lib/scoring/format';
import type { MetaAnalysisTarget } from '@/lib/swr/keys';
import { useMetaAnalysis } from '@/lib/swr/use-meta-analysis';
import { ForestPlot } from './ForestPlot';
import { describeI2, describeTau2, measureWords } from './heterogeneity';

const n2 = (x: number) => formatNumber(x, 2);
const pText = (p: number | undefined) => (p === undefined ? '—' : p < 0.001 ? '< 0.001' : formatNumber(p, 3));

/**
 * The pooled effect of the appraisals of one mechanism (or of the outcome) that carry effect
 * sizes: a forest plot, heterogeneity in words, and every number in a table. The workbench
 * mounts it only when two or more such appraisals exist.
 */
export function MetaAnalysisPanel({
  reviewId,
  target,
  subject,
}: {
  reviewId: number;
  target: MetaAnalysisTarget;
  /** What is pooled, for titles: "Tendon stiffness" or "the claimed outcome". */
  subject: string;
}) {
  const { data, error, mutate } = useMetaAnalysis(reviewId, target);

  if (error && !data) {
    return (
      <div
        role="alert"
        className="bg-danger-50 text-danger-800 flex flex-wrap items-center justify-between gap-2 rounded-md px-4 py-3 text-sm"
      >
        <span>The meta-analysis could not be computed: {error.message}</span>
        <Button size="sm" variant="secondary" onClick={() => void mutate()}>
          Try again
        </Button>
      </div>
    );
  }
  if (!data) return <Skeleton className="h-48 w-full" />;
  const random = data.random;
  const fixed = data.fixed;
  const { words } = measureWords(data.measure);
  const title = `Forest plot: ${data.k} studies on ${subject}`;

  return (
    <figure className="space-y-4" aria-label={title}>
      <ForestPlot
        title={title}
        measure={data.measure}
        axisLabel={data.measureLabel}
        sides={{ left: 'against the claim', right: 'the claimed effect' }}
        rows={data.studies.map((s) => ({
          id: s.appraisalId,
          label: s.citation,
          effectSize: s.effectSize,
          ciLow: s.ciLow,
          ciHigh: s.ciHigh,
          weight: s.weight,
        }))}
        pooled={{
          label: 'Pooled (random effects)',
          estimate: random.estimate,
          ciLow: random.ci[0],
          ciHigh: random.ci[1],
        }}
        predictionInterval={random.predictionInterval ?? null}
      />
      <figcaption className="space-y-2 text-sm">
        <p className="text-ink-muted" data-testid="forest-orientation">
          Right of 0 is the claimed effect.
          {data.desirable === 'lower'
            ? ' Here a lower value on the studies’ measure is the claimed effect, so every effect is drawn with its sign flipped.'
            : ''}
        </p>
        <p>
          <strong>Pooled effect {n2(random.estimate)}</strong> (95 % CI {n2(random.ci[0])} to {n2(random.ci[1])}; z ={' '}
          {n2(random.z)}, p {pText(random.p)}), random effects over {data.k} studies, as{' '}
          {data.measureLabel.charAt(0).toLowerCase() + data.measureLabel.slice(1)}
          {fixed ? `; the fixed-effect estimate is ${n2(fixed.estimate)}` : ''}.
        </p>
        {data.excluded.length > 0 && (
          <p className="text-ink-muted">
            Left out: {data.excluded.map((e) => `${e.citation} (${e.reason})`).join('; ')}.
          </p>
        )}
        <p data-testid="i2-words">{describeI2(random.I2)}</p>
        <p>{describeTau2(random.tau2, words)}</p>
        {random.predictionInterval ? (
          <p>
            A new study like these would most likely find an effect between {n2(random.predictionInterval[0])} and{' '}
            {n2(random.predictionInterval[1])} (95 % prediction interval).
          </p>
        ) : (
          <p className="text-ink-muted">A prediction interval needs three studies or more.</p>
        )}
      </figcaption>
      <details className="border-line rounded-md border">
        <summary className="text-brand cursor-pointer px-3 py-2 text-sm font-semibold">The numbers as a table</summary>
        <div className="relative overflow-x-auto px-3 pb-3">
          <table className="w-full min-w-[28rem] text-sm">
            <caption className="sr-only">{title}</caption>
            <thead>
              <tr className="border-line text-ink-muted border-b text-left text-xs uppercase">
                <th scope="col" className="py-1.5 pr-2">
                  Study
                </th>
                <th scope="col" className="py-1.5 pr-2 text-right">
                  Effect
                </th>
                <th scope="col" className="py-1.5 pr-2 text-right">
                  95 % CI
                </th>
                <th scope="col" className="py-1.5 pr-2 text-right">
                  Variance
                </th>
                <th scope="col" className="py-1.5 text-right">
                  Weight
                </th>
              </tr>
            </thead>
            <tbody className="tabular-nums">
              {data.studies.map((s) => (
                <tr key={s.appraisalId} className="border-line border-b">
                  <th scope="row" className="py-1.5 pr-2 text-left font-normal">
                    {s.citation}
                  </th>
                  <td className="py-1.5 pr-2 text-right">{n2(s.effectSize)}</td>
                  <td className="py-1.5 pr-2 text-right">
                    {n2(s.ciLow)} to {n2(s.ciHigh)}
                  </td>
                  <td className="py-1.5 pr-2 text-right">{formatNumber(s.variance, 4)}</td>
                  <td className="py-1.5 text-right">{n2(s.weight)} %</td>
                </tr>
              ))}
              <tr className="font-semibold">
                <th scope="row" className="py-1.5 pr-2 text-left">
                  Pooled (random effects)
                </th>
                <td className="py-1.5 pr-2 text-right">{n2(random.estimate)}</td>
                <td className="py-1.5 pr-2 text-right">
                  {n2(random.ci[0])} to {n2(random.ci[1])}
                </td>
                <td className="py-1.5 pr-2 text-right">SE {formatNumber(random.se, 4)}</td>
                <td className="py-1.5 text-right">100 %</td>
              </tr>
            </tbody>
          </table>
          <p className="text-ink-muted mt-2 text-xs">
            Q {n2(random.Q)} on {random.df} df (p {pText(random.pQ)}) · τ² {formatNumber(random.tau2, 4)} · I²{' '}
            {n2(random.I2)} %{random.H2 !== undefined ? ` · H² ${n2(random.H2)}` : ''}
          </p>
        </div>
      </details>
    </figure>
  );
}
