'use client';

import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { DIRECTION_LABEL } from '@/components/review/labels';
import { LocalTime } from '@/components/review/LocalTime';
import type { Concern, Direction } from '@/lib/reviews/types';
import { CONCERN_INFO, DOMAIN_INFO, DOWNGRADE_DOMAINS } from '@/lib/scoring/appraisal-vocabulary';
import { Badge } from '@/components/ui/Badge';
import { Button } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { cn } from '@/components/ui/cn';
import {
  CONTRIBUTIONS,
  CONTRIBUTION_LABEL,
  SIGN_OFFS,
  SIGN_OFF_LABEL,
  type Contribution,
  type RatingDTO,
  type ScorecardViewDTO,
  type SignOff,
} from '@/lib/rounds/types';
import { apiFetch, ApiError, errorMessage } from '@/lib/swr/fetcher';
import { AgreementPanel } from './AgreementPanel';
import { BandPicker } from './BandPicker';
import { CommentThreads } from './CommentThreads';
import { protocolLine } from './labels';
import { ReviewBody } from './ReviewBody';
import { useAgreement } from './use-rounds';

type SaveState = { kind: 'idle' | 'saving' | 'saved' | 'error'; at?: string; message?: string };

const percent = (x: number | null) => (x === null ? null : `${Math.round(x * 100)} %`);

/**
 * The reviewer's scorecard: the review as the author wrote it (never the engine's output),
 * a likelihood band, a contribution and a comment per mechanism, an overall comment and a
 * sign-off. The draft saves itself a moment after each change; submitting is final.
 */
export function ScorecardPage({ view }: { view: ScorecardViewDTO }) {
  const { round, review, mechanisms, studies, appraisals } = view;
  const [ratings, setRatings] = useState<RatingDTO[]>(view.scorecard.ratings);
  const [overall, setOverall] = useState(view.scorecard.overallComment);
  const [signOff, setSignOff] = useState<SignOff | null>(view.scorecard.signOff);
  const [submittedAt, setSubmittedAt] = useState<string | null>(view.scorecard.submittedAt);
  const [save, setSave] = useState<SaveState>({
    kind: view.scorecard.updatedAt ? 'saved' : 'idle',
    at: view.scorecard.updatedAt ?? undefined,
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [submitError, setSubmitError] = useState<string | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [submitting, setSubmitting] = useState(false);
  const dirty = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  const locked = Boolean(submittedAt) || round.status !== 'open';
  const studyById = useMemo(() => new Map(studies.map((s) => [s.id, s])), [studies]);
  const mechanismById = useMemo(() => new Map(mechanisms.map((m) => [m.id, m])), [mechanisms]);

  const payload = useCallback(
    (submit: boolean) => ({ ratings, overallComment: overall, signOff, submit }),
    [ratings, overall, signOff],
  );

  const saveDraft = useCallback(async () => {
    if (locked) return;
    setSave({ kind: 'saving' });
    try {
      const res = await apiFetch<{ scorecard: { updatedAt: string } }>(
        `/api/reviews/${review.id}/rounds/${round.id}/scorecard`,
        { method: 'PUT', json: payload(false) },
      );
      dirty.current = false;
      setSave({ kind: 'saved', at: res.scorecard.updatedAt });
    } catch (error) {
      // The draft stays on screen; the next change (or the retry button) saves it again.
      setSave({ kind: 'error', message: errorMessage(error) });
    }
  }, [locked, payload, review.id, round.id]);

  // Autosave: a moment after the last change.
  useEffect(() => {
    if (!dirty.current || locked) return;
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void saveDraft(), 700);
    return () => {
      if (timer.current) clearTimeout(timer.current);
    };
  }, [ratings, overall, signOff, saveDraft, locked]);

  // Warn before leaving with changes the server has not confirmed.
  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (dirty.current) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, []);

  const change = (mechanismId: number, patch: Partial<RatingDTO>) => {
    dirty.current = true;
    setRatings((list) => list.map((r) => (r.mechanismId === mechanismId ? { ...r, ...patch } : r)));
    setErrors((e) => {
      const next = { ...e };
      for (const key of Object.keys(patch)) delete next[`mechanism.${mechanismId}.${key}`];
      return next;
    });
  };

  const submit = async () => {
    setSubmitting(true);
    setSubmitError(null);
    if (timer.current) clearTimeout(timer.current);
    try {
      const res = await apiFetch<{ scorecard: { submittedAt: string }; mailFailures: string[] }>(
        `/api/reviews/${review.id}/rounds/${round.id}/scorecard`,
        { method: 'PUT', json: payload(true) },
      );
      dirty.current = false;
      setSubmittedAt(res.scorecard.submittedAt);
      setConfirming(false);
      window.scrollTo({ top: 0 });
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) {
        const map: Record<string, string> = {};
        for (const issue of error.issues) map[issue.path] = issue.message;
        setErrors(map);
      }
      setSubmitError(errorMessage(error));
      setConfirming(false);
    } finally {
      setSubmitting(false);
    }
  };

  const outcomeAppraisals = appraisals.filter((a) => a.mechanismId === null);

  return (
    <div className="space-y-8">
      <header className="space-y-3">
        <p className="flex flex-wrap items-center gap-2 text-sm">
          <Badge tone="brand">Peer review</Badge>
          {round.status === 'closed' ? <Badge>Round closed</Badge> : <Badge tone="accent">Open</Badge>}
          {submittedAt ? <Badge tone="success">You submitted</Badge> : <Badge>Blind until you submit</Badge>}
          <span className="text-ink-muted">
            by {review.authorName} · due <LocalTime iso={round.dueAt} />
          </span>
        </p>
        <h1 className="text-2xl font-semibold sm:text-3xl">{review.title}</h1>
        <blockquote className="border-rope-500 border-l-4 pl-4">
          <p className="font-display text-lg leading-snug">“{review.claim}”</p>
          {review.claimSource && <footer className="text-ink-muted mt-1 text-sm">{review.claimSource}</footer>}
        </blockquote>
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
          <dt className="font-semibold">Protocol</dt>
          <dd className="text-ink-muted">{protocolLine(review.protocol)}</dd>
          <dt className="font-semibold">For</dt>
          <dd className="text-ink-muted">
            {review.population.status ?? 'any training status'}, {review.population.injured ? 'injured' : 'healthy'}
          </dd>
        </dl>
        {round.note && (
          <p className="border-line bg-paper-sunken rounded-md border px-4 py-3 text-sm">
            <span className="font-semibold">Note from {round.openedByName}:</span> {round.note}
          </p>
        )}
        {!submittedAt && round.status === 'open' && (
          <p className="text-ink-muted max-w-measure text-sm">
            Score each mechanism from the author’s analysis and evidence below. The engine’s probabilities and the other
            reviewers’ scores stay hidden until you submit. Your draft saves itself as you go.
          </p>
        )}
      </header>

      {submittedAt && <SubmittedAgreement reviewId={review.id} roundId={round.id} submittedAt={submittedAt} />}

      <Card aria-labelledby="analysis">
        <CardHeader id="analysis" title="The author’s analysis" />
        <CardBody>
          <ReviewBody
            body={review.body}
            mechanismName={(id) => mechanismById.get(id)?.name}
            citation={(id) => studyById.get(id)?.citation}
          />
        </CardBody>
      </Card>

      <section aria-labelledby="score-heading" className="space-y-4">
        <h2 id="score-heading" className="text-xl font-semibold">
          {locked ? 'Your scores' : 'Score each mechanism'}
        </h2>
        {mechanisms.length === 0 && <p className="text-ink-muted">This review has no mechanisms to score.</p>}
        {mechanisms.map((m, index) => {
          const rating = ratings.find((r) => r.mechanismId === m.id)!;
          const evidence = appraisals.filter((a) => a.mechanismId === m.id);
          return (
            <Card
              key={m.id}
              id={`mechanism-${m.id}`}
              aria-labelledby={`mechanism-title-${m.id}`}
              className="scroll-mt-24"
            >
              <CardHeader
                as="h3"
                id={`mechanism-title-${m.id}`}
                title={`${index + 1}. ${m.name}`}
                description={
                  <>
                    {m.kind}
                    {m.stated && ' · the claim’s stated mechanism'} · author’s prior {percent(m.prior)} · magnitude{' '}
                    {m.magnitude}
                    {m.minIntensity !== null && ` · needs ≥ ${percent(m.minIntensity)} of max`}
                    {m.minEffort && ` · needs ${m.minEffort.replace('-', ' ')} effort`}
                  </>
                }
              />
              <CardBody className="space-y-5">
                {m.summary && <p className="max-w-measure">{m.summary}</p>}
                <EvidenceList evidence={evidence} studyById={studyById} />
                <BandPicker
                  name={`band-${m.id}`}
                  legend={`How likely is it that “${m.name}” explains the result?`}
                  value={rating.band}
                  onChange={(band) => change(m.id, { band })}
                  error={errors[`mechanism.${m.id}.band`]}
                  disabled={locked}
                />
                <fieldset disabled={locked} aria-invalid={errors[`mechanism.${m.id}.contribution`] ? true : undefined}>
                  <legend className="mb-2 text-sm font-semibold">If it works, how much does it contribute?</legend>
                  <div className="flex flex-wrap gap-2">
                    {CONTRIBUTIONS.map((c) => (
                      <label
                        key={c}
                        className={cn(
                          'has-[:focus-visible]:outline-rope-500 flex min-h-11 cursor-pointer items-center rounded-md border px-4 text-sm font-medium has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2',
                          rating.contribution === c
                            ? 'border-granite-700 bg-granite-700 text-white'
                            : 'border-line-strong bg-paper-raised hover:border-granite-400',
                        )}
                      >
                        <input
                          type="radio"
                          className="sr-only"
                          name={`contribution-${m.id}`}
                          value={c}
                          checked={rating.contribution === c}
                          onChange={() => change(m.id, { contribution: c as Contribution })}
                        />
                        {CONTRIBUTION_LABEL[c]}
                      </label>
                    ))}
                  </div>
                  {errors[`mechanism.${m.id}.contribution`] && (
                    <p className="text-danger-700 mt-1.5 text-sm font-medium">
                      {errors[`mechanism.${m.id}.contribution`]}
                    </p>
                  )}
                </fieldset>
                <div>
                  <label htmlFor={`comment-${m.id}`} className="block text-sm font-semibold">
                    Your comment on this mechanism <span className="text-ink-muted font-normal">(optional)</span>
                  </label>
                  <textarea
                    id={`comment-${m.id}`}
                    rows={2}
                    value={rating.comment}
                    readOnly={locked}
                    onChange={(e) => change(m.id, { comment: e.target.value })}
                    className="border-line-strong bg-paper-raised read-only:bg-paper-sunken mt-1 block w-full rounded-md border px-3 py-2"
                  />
                </div>
              </CardBody>
            </Card>
          );
        })}
      </section>

      {outcomeAppraisals.length > 0 && (
        <Card aria-labelledby="outcome-evidence">
          <CardHeader id="outcome-evidence" title="Evidence on the claimed outcome itself" />
          <CardBody>
            <EvidenceList evidence={outcomeAppraisals} studyById={studyById} />
          </CardBody>
        </Card>
      )}

      <Card aria-labelledby="sign-off-heading">
        <CardHeader id="sign-off-heading" title="Overall" />
        <CardBody className="space-y-5">
          <div>
            <label htmlFor="overall-comment" className="block text-sm font-semibold">
              Overall comment <span className="text-ink-muted font-normal">(optional)</span>
            </label>
            <textarea
              id="overall-comment"
              rows={4}
              value={overall}
              readOnly={locked}
              onChange={(e) => {
                dirty.current = true;
                setOverall(e.target.value);
              }}
              className="border-line-strong bg-paper-raised read-only:bg-paper-sunken mt-1 block w-full rounded-md border px-3 py-2"
            />
          </div>
          <fieldset disabled={locked} aria-invalid={errors.signOff ? true : undefined}>
            <legend className="mb-2 text-sm font-semibold">Your sign-off</legend>
            <div className="flex flex-wrap gap-2">
              {SIGN_OFFS.map((s) => (
                <label
                  key={s}
                  className={cn(
                    'has-[:focus-visible]:outline-rope-500 flex min-h-11 cursor-pointer items-center rounded-md border px-4 text-sm font-medium has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2',
                    signOff === s
                      ? s === 'do-not-publish'
                        ? 'border-danger-700 bg-danger-700 text-white'
                        : 'border-granite-700 bg-granite-700 text-white'
                      : 'border-line-strong bg-paper-raised hover:border-granite-400',
                  )}
                >
                  <input
                    type="radio"
                    className="sr-only"
                    name="signOff"
                    value={s}
                    checked={signOff === s}
                    onChange={() => {
                      dirty.current = true;
                      setSignOff(s);
                      setErrors(({ signOff: _gone, ...rest }) => rest);
                    }}
                  />
                  {SIGN_OFF_LABEL[s]}
                </label>
              ))}
            </div>
            {errors.signOff && <p className="text-danger-700 mt-1.5 text-sm font-medium">{errors.signOff}</p>}
          </fieldset>

          {!locked && (
            <div className="border-line flex flex-wrap items-center gap-3 border-t pt-4">
              {!confirming ? (
                <Button onClick={() => setConfirming(true)}>Submit scorecard</Button>
              ) : (
                <div role="group" aria-label="Confirm submission" className="flex flex-wrap items-center gap-2">
                  <span className="text-sm font-semibold">Submit now? You cannot change your scores afterwards.</span>
                  <Button onClick={submit} disabled={submitting}>
                    {submitting ? 'Submitting…' : 'Yes, submit'}
                  </Button>
                  <Button variant="ghost" onClick={() => setConfirming(false)}>
                    Not yet
                  </Button>
                </div>
              )}
              <SaveStatus state={save} onRetry={saveDraft} />
            </div>
          )}
          <div role="alert" aria-live="assertive">
            {submitError && (
              <p className="border-danger-100 bg-danger-50 text-danger-800 rounded-md border px-3 py-2.5 text-sm font-medium">
                {submitError}
              </p>
            )}
          </div>
        </CardBody>
      </Card>

      {(submittedAt || round.status === 'open') && (
        <CommentThreads
          reviewId={review.id}
          roundId={round.id}
          mechanisms={mechanisms.map((m) => ({ id: m.id, name: m.name }))}
          open={round.status === 'open'}
          canResolve={false}
        />
      )}
    </div>
  );
}

function SaveStatus({ state, onRetry }: { state: SaveState; onRetry: () => void }) {
  return (
    <p role="status" aria-live="polite" className="text-ink-muted text-sm">
      {state.kind === 'saving' && 'Saving your draft…'}
      {state.kind === 'saved' && state.at && (
        <>
          Draft saved <LocalTime iso={state.at} />
        </>
      )}
      {state.kind === 'error' && (
        <span className="text-danger-700">
          Not saved: {state.message}{' '}
          <button type="button" className="font-semibold underline" onClick={onRetry}>
            Try again
          </button>
        </span>
      )}
    </p>
  );
}

function EvidenceList({
  evidence,
  studyById,
}: {
  evidence: ScorecardViewDTO['appraisals'];
  studyById: Map<number, ScorecardViewDTO['studies'][number]>;
}) {
  if (!evidence.length) return <p className="text-ink-muted text-sm">No studies appraised for this yet.</p>;
  return (
    <ul className="space-y-2">
      {evidence.map((a) => {
        const s = studyById.get(a.studyId);
        const concerns = DOWNGRADE_DOMAINS.filter((d) => a[d] !== 'none').map(
          (d) => `${DOMAIN_INFO[d].label.toLowerCase()}: ${CONCERN_INFO[a[d] as Concern]?.label.toLowerCase() ?? a[d]}`,
        );
        return (
          <li key={a.id} className="border-line rounded-md border px-3 py-2 text-sm">
            <p>
              <span className="font-semibold">{s?.citation ?? 'Unknown study'}</span>{' '}
              <Badge tone={a.direction === 'supports' ? 'success' : a.direction === 'against' ? 'danger' : 'neutral'}>
                {DIRECTION_LABEL[a.direction as Direction]?.toLowerCase() ?? a.direction}
              </Badge>
            </p>
            {s && (
              <p className="text-ink-muted">
                {s.title}
                {s.design && ` · ${s.design}`}
                {s.n !== null && ` · n = ${s.n}`}
                {s.population && ` · ${s.population}`}
                {s.intensity !== null && ` · ${Math.round(s.intensity * 100)} % of max`}
              </p>
            )}
            <p className="text-ink-muted">
              {concerns.length ? `Author’s concerns: ${concerns.join('; ')}` : 'No certainty concerns recorded.'}
            </p>
            {a.notes && <p className="mt-1">{a.notes}</p>}
          </li>
        );
      })}
    </ul>
  );
}

function SubmittedAgreement({
  reviewId,
  roundId,
  submittedAt,
}: {
  reviewId: number;
  roundId: number;
  submittedAt: string;
}) {
  const { data, error } = useAgreement(reviewId, roundId);
  return (
    <section aria-labelledby="after-submit" className="space-y-4">
      <div className="border-success-100 bg-success-50 text-success-800 rounded-md border px-4 py-3" role="status">
        <h2 id="after-submit" className="text-base font-semibold">
          Submitted <LocalTime iso={submittedAt} />
        </h2>
        <p className="text-sm">Your scores are final. Here is how they compare with the others’ and with the engine.</p>
      </div>
      {error && (
        <p role="alert" className="text-danger-700 text-sm">
          The agreement could not be loaded: {error.message}
        </p>
      )}
      {data && <AgreementPanel agreement={data} />}
    </section>
  );
}
