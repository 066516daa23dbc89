'use client';

import type { ReactNode } from 'react';
import { Badge } from '@/components/ui/Badge';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { cn } from '@/components/ui/cn';
import {
  CONTRIBUTION_LABEL,
  RESOLUTION_LABEL,
  SIGN_OFF_LABEL,
  type AgreementDTO,
  type MechanismAgreementDTO,
} from '@/lib/rounds/types';
import { bandLabel } from './labels';
import { RatingDots } from './RatingDots';

const ALPHA_WORDS = {
  reliable: 'reliable agreement',
  tentative: 'tentative: draw conclusions with care',
  unreliable: 'unreliable: the reviewers read it differently',
} as const;

const fmt = (x: number | null | undefined) => (x === null || x === undefined ? '—' : x.toFixed(3));

/**
 * Where and how much the reviewers disagree: Krippendorff's α (ordinal) with its reading,
 * weighted κ for two reviewers, then every mechanism's ratings with the flagged ones first.
 * The engine's band is shown beside the reviewers' for comparison and never counted in α.
 */
export function AgreementPanel({
  agreement,
  renderResolution,
}: {
  agreement: AgreementDTO;
  renderResolution?: (row: MechanismAgreementDTO) => ReactNode;
}) {
  const a = agreement;
  return (
    <div className="space-y-6">
      <Card aria-labelledby="agreement-figures">
        <CardHeader
          id="agreement-figures"
          title="Agreement"
          description={`${a.raters} submitted scorecard${a.raters === 1 ? '' : 's'}; drafts never count.`}
        />
        <CardBody>
          <dl className="grid gap-4 sm:grid-cols-3">
            <div className="border-line rounded-md border p-4">
              <dt className="text-ink-muted text-sm font-semibold">Krippendorff’s α (ordinal)</dt>
              <dd className="font-display mt-1 text-3xl font-semibold" data-testid="alpha">
                {a.alpha.missing ? '—' : fmt(a.alpha.ordinal)}
              </dd>
              <dd className="text-ink-muted mt-1 text-sm">
                {a.alpha.interpretation ? ALPHA_WORDS[a.alpha.interpretation] : (a.alpha.missing ?? '')}
              </dd>
            </div>
            <div className="border-line rounded-md border p-4">
              <dt className="text-ink-muted text-sm font-semibold">Cohen’s weighted κ</dt>
              {a.kappa ? (
                <>
                  <dd className="font-display mt-1 text-3xl font-semibold">{fmt(a.kappa.linear)}</dd>
                  <dd className="text-ink-muted mt-1 text-sm">
                    linear weights, {a.kappa.interpretation} (Landis &amp; Koch); quadratic {fmt(a.kappa.quadratic)}
                  </dd>
                </>
              ) : (
                <dd className="text-ink-muted mt-1 text-sm">
                  {a.raters === 2 && a.alpha.missing
                    ? a.alpha.missing
                    : 'Shown when exactly two reviewers have submitted.'}
                </dd>
              )}
            </div>
            <div className="border-line rounded-md border p-4">
              <dt className="text-ink-muted text-sm font-semibold">Flagged mechanisms</dt>
              <dd className="font-display mt-1 text-3xl font-semibold">{a.flaggedCount}</dd>
              <dd className="text-ink-muted mt-1 text-sm">
                ratings two or more bands apart
                {a.flaggedCount > 0 && `; ${a.unresolvedFlags} still to resolve`}
              </dd>
            </div>
          </dl>
          <p className="text-ink-muted mt-4 text-xs">
            Other metrics of α: nominal {fmt(a.alpha.nominal)}, interval {fmt(a.alpha.interval)}. α reads ≥ 0.800 as
            reliable and 0.667–0.800 as tentative (Krippendorff).
          </p>
        </CardBody>
      </Card>

      <section aria-labelledby="per-mechanism" className="space-y-3">
        <h2 id="per-mechanism" className="text-xl font-semibold">
          Mechanism by mechanism
        </h2>
        <p className="text-ink-muted text-sm">
          Dots are reviewers’ ratings on the seven likelihood bands (0 exceptionally unlikely … 6 virtually certain);
          the hollow diamond is the engine’s band for comparison.
        </p>
        {a.mechanisms.length === 0 && <p className="text-ink-muted">This review has no mechanisms.</p>}
        <ol className="space-y-3">
          {a.mechanisms.map((m) => (
            <li
              key={m.mechanismId}
              id={`agreement-${m.mechanismId}`}
              className={cn(
                'bg-paper-raised shadow-card rounded-lg border p-4',
                m.flagged ? (m.resolution ? 'border-granite-300' : 'border-rope-400') : 'border-line',
              )}
            >
              <div className="flex flex-wrap items-start justify-between gap-3">
                <div className="min-w-0">
                  <h3 className="text-base font-semibold">{m.name}</h3>
                  <p className="mt-1 flex flex-wrap gap-1.5">
                    {m.flagged && (
                      <Badge tone={m.resolution ? 'brand' : 'accent'}>
                        {m.resolution ? 'Flag resolved' : 'Flagged'}
                      </Badge>
                    )}
                    <Badge>span {m.span ?? '—'}</Badge>
                    <Badge>engine: {bandLabel(m.engineBand).toLowerCase()}</Badge>
                  </p>
                </div>
                <RatingDots bands={m.ratings.map((r) => r.band)} engineBand={m.engineBand} label={m.name} />
              </div>
              {m.ratings.length > 0 ? (
                <table className="mt-3 w-full text-left text-sm">
                  <caption className="sr-only">Ratings of {m.name}</caption>
                  <thead className="text-ink-muted text-xs">
                    <tr>
                      <th scope="col" className="py-1 pr-3 font-semibold">
                        Reviewer
                      </th>
                      <th scope="col" className="py-1 pr-3 font-semibold">
                        Likelihood
                      </th>
                      <th scope="col" className="hidden py-1 pr-3 font-semibold sm:table-cell">
                        Contribution
                      </th>
                      <th scope="col" className="hidden py-1 font-semibold md:table-cell">
                        Comment
                      </th>
                    </tr>
                  </thead>
                  <tbody>
                    {m.ratings.map((r) => (
                      <tr key={r.reviewerId} className="border-line border-t align-top">
                        <th scope="row" className="py-1.5 pr-3 font-medium">
                          {r.reviewerName}
                        </th>
                        <td className="py-1.5 pr-3">
                          {r.band} · {bandLabel(r.band).toLowerCase()}
                          <span className="text-ink-muted block sm:hidden">
                            {r.contribution ? `${CONTRIBUTION_LABEL[r.contribution]} contribution` : ''}
                          </span>
                          {r.comment && <span className="text-ink-muted block md:hidden">“{r.comment}”</span>}
                        </td>
                        <td className="hidden py-1.5 pr-3 sm:table-cell">
                          {r.contribution ? CONTRIBUTION_LABEL[r.contribution] : '—'}
                        </td>
                        <td className="text-ink-muted hidden py-1.5 md:table-cell">{r.comment || '—'}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              ) : (
                <p className="text-ink-muted mt-3 text-sm">No submitted ratings yet.</p>
              )}
              {m.resolution && (
                <p className="bg-granite-50 text-granite-900 mt-3 rounded-md px-3 py-2 text-sm">
                  <strong>{RESOLUTION_LABEL[m.resolution.kind]}</strong> ({m.resolution.byName}): {m.resolution.reason}
                </p>
              )}
              {renderResolution?.(m)}
            </li>
          ))}
        </ol>
      </section>

      {a.signOffs.length > 0 && (
        <section aria-labelledby="sign-offs" className="space-y-2">
          <h2 id="sign-offs" className="text-xl font-semibold">
            Sign-offs
          </h2>
          <ul className="space-y-2">
            {a.signOffs.map((s) => (
              <li key={s.reviewerId} className="border-line bg-paper-raised rounded-md border px-4 py-3 text-sm">
                <span className="font-semibold">{s.reviewerName}</span>{' '}
                <Badge
                  tone={s.signOff === 'do-not-publish' ? 'danger' : s.signOff === 'approve' ? 'success' : 'warning'}
                >
                  {s.signOff ? SIGN_OFF_LABEL[s.signOff] : 'No sign-off'}
                </Badge>
                {s.overallComment && <p className="text-ink-muted mt-1">{s.overallComment}</p>}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}
