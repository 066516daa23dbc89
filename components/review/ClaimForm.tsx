'use client';

import { useRouter } from 'next/navigation';
import { SimilarReviews } from '@/components/search/SimilarReviews';
import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { useSWRConfig } from 'swr';
import { Button } from '@/components/ui/Button';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/Field';
import type { Desirable } from '@/lib/scoring/direction';
import { DesirableField } from './DesirableField';
import { weeklySecondsFromProtocol } from './time-under-load';
import { FormMessage } from '@/components/ui/FormMessage';
import { Spinner } from '@/components/ui/Spinner';
import { convertLoad } from '@/lib/reviews/protocol';
import {
  EFFORTS,
  LOAD_UNITS,
  TRAINING_STATUSES,
  type Effort,
  type LoadUnit,
  type ReviewDTO,
  type TrainingStatus,
} from '@/lib/reviews/types';
import { ApiError, apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { isReviewListKey } from '@/lib/swr/keys';
import { createReviewSchema, updateReviewSchema } from '@/lib/validation/reviews';
import { focusFirstInvalid, issuesToErrors, withoutFieldError } from '@/components/ui/form-errors';
import { duration, EFFORT_LABEL, LOAD_UNIT_HELP, LOAD_UNIT_LABEL, percent, TRAINING_STATUS_LABEL } from './labels';

const BODYWEIGHT_UNITS: readonly LoadUnit[] = ['percent-bodyweight', 'kg-added'];

/** Everything as typed: numbers stay text until submit so a half-typed "7," is not lost. */
interface Draft {
  teamId: string;
  title: string;
  claim: string;
  claimSource: string;
  claimUrl: string;
  exercise: string;
  loadValue: string;
  loadUnit: LoadUnit | '';
  referenceBodyweightKg: string;
  referenceMaxAddedKg: string;
  secondsPerSet: string;
  setsPerSession: string;
  sessionsPerDay: string;
  daysPerWeek: string;
  minHoursBetween: string;
  weeks: string;
  effort: Effort | '';
  status: TrainingStatus | '';
  injured: boolean;
  outcomeDesirable: Desirable;
  tags: string;
}

/** The protocol's schedule, one optional number each, in the order a coach reads a programme. */
const SCHEDULE_FIELDS: {
  key: 'secondsPerSet' | 'setsPerSession' | 'sessionsPerDay' | 'daysPerWeek' | 'minHoursBetween' | 'weeks';
  label: string;
  help?: string;
  inputMode: 'decimal' | 'numeric';
}[] = [
  { key: 'secondsPerSet', label: 'Seconds per set', help: 'Time under load in one set.', inputMode: 'decimal' },
  { key: 'setsPerSession', label: 'Sets per session', inputMode: 'numeric' },
  { key: 'sessionsPerDay', label: 'Sessions per day', inputMode: 'numeric' },
  { key: 'daysPerWeek', label: 'Days per week', help: 'Empty means every day.', inputMode: 'numeric' },
  { key: 'minHoursBetween', label: 'Rest between sessions (h)', help: 'The minimum, in hours.', inputMode: 'decimal' },
  { key: 'weeks', label: 'Weeks', inputMode: 'decimal' },
];

const text = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

function fromReview(review: ReviewDTO | undefined, teamId: number | undefined): Draft {
  const p = review?.protocol;
  return {
    teamId: teamId ? String(teamId) : '',
    title: review?.title ?? '',
    claim: review?.claim ?? '',
    claimSource: review?.claimSource ?? '',
    claimUrl: review?.claimUrl ?? '',
    exercise: p?.exercise ?? '',
    loadValue: text(p?.loadValue),
    loadUnit: p?.loadUnit ?? '',
    referenceBodyweightKg: text(p?.referenceBodyweightKg),
    referenceMaxAddedKg: text(p?.referenceMaxAddedKg),
    secondsPerSet: text(p?.secondsPerSet),
    setsPerSession: text(p?.setsPerSession),
    sessionsPerDay: text(p?.sessionsPerDay),
    daysPerWeek: text(p?.daysPerWeek),
    minHoursBetween: text(p?.minHoursBetween),
    weeks: text(p?.weeks),
    effort: p?.effort ?? '',
    status: review?.population.status ?? '',
    injured: review?.population.injured ?? false,
    outcomeDesirable: review?.outcomeDesirable ?? 'higher',
    tags: review?.tags.join(', ') ?? '',
  };
}

/** '' → null; otherwise a number (NaN when it is not one, which the schema reports by field). */
const num = (value: string): number | null => (value.trim() === '' ? null : Number(value.trim().replace(',', '.')));

function toBody(d: Draft) {
  const bodyweightUnit = d.loadUnit !== '' && BODYWEIGHT_UNITS.includes(d.loadUnit);
  return {
    title: d.title.trim() === '' ? undefined : d.title,
    claim: d.claim,
    claimSource: d.claimSource,
    claimUrl: d.claimUrl.trim() === '' ? null : d.claimUrl.trim(),
    protocol: {
      exercise: d.exercise,
      loadValue: num(d.loadValue),
      loadUnit: d.loadUnit === '' ? null : d.loadUnit,
      // Only a body-weight unit needs the reference athlete; sending stale numbers for another
      // unit would only confuse the next person who reads the protocol.
      referenceBodyweightKg: bodyweightUnit ? num(d.referenceBodyweightKg) : null,
      referenceMaxAddedKg: bodyweightUnit ? num(d.referenceMaxAddedKg) : null,
      secondsPerSet: num(d.secondsPerSet),
      setsPerSession: num(d.setsPerSession),
      sessionsPerDay: num(d.sessionsPerDay),
      daysPerWeek: num(d.daysPerWeek),
      minHoursBetween: num(d.minHoursBetween),
      weeks: num(d.weeks),
      effort: d.effort === '' ? null : d.effort,
    },
    population: { status: d.status === '' ? null : d.status, injured: d.injured },
    outcomeDesirable: d.outcomeDesirable,
    tags: d.tags
      .split(',')
      .map((t) => t.trim())
      .filter(Boolean),
  };
}

function Section({ title, description, children }: { title: string; description?: ReactNode; children: ReactNode }) {
  const id = useId();
  return (
    <fieldset
      className="border-line bg-paper-raised shadow-card space-y-4 rounded-lg border px-5 pt-3 pb-5"
      aria-describedby={description ? `${id}-d` : undefined}
    >
      <legend className="font-display px-1 text-lg font-semibold">{title}</legend>
      {description && (
        <p id={`${id}-d`} className="text-ink-muted -mt-2 text-sm">
          {description}
        </p>
      )}
      {children}
    </fieldset>
  );
}

/**
 * Step 1 of a review: the claim in one sentence, who made it and where, and the protocol as a
 * structured dose with units — converted live to the one intensity scale the scoring uses, so the
 * coach sees what the engine will compare against each mechanism's minimum.
 *
 * Create mode posts to /api/reviews and opens the new workbench; edit mode hands the changed
 * fields to the workbench, which saves them with the review's version.
 */
export function ClaimForm({
  teams,
  review,
  onSaved,
  onCancel,
  submitLabel,
  onSubmitEdit,
}: {
  /** Teams the person may create reviews in (create mode). */
  teams?: ReadonlyArray<{ id: number; name: string }>;
  /** The review being edited (edit mode). */
  review?: ReviewDTO;
  onSaved?: (review: ReviewDTO) => void;
  onCancel?: () => void;
  submitLabel?: string;
  onSubmitEdit?: (fields: ReturnType<typeof toBody>) => Promise<ReviewDTO>;
}) {
  const router = useRouter();
  const { mutate } = useSWRConfig();
  const editing = Boolean(review);
  const [draft, setDraft] = useState<Draft>(() => fromReview(review, review?.teamId ?? teams?.[0]?.id));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));
  const field = (key: keyof Draft, path: string = key) => ({ name: path, errors: errors[path] });

  const body = toBody(draft);
  const conversion =
    body.protocol.loadValue !== null && Number.isFinite(body.protocol.loadValue) && body.protocol.loadUnit
      ? convertLoad(body.protocol)
      : null;
  const bodyweightUnit = draft.loadUnit !== '' && BODYWEIGHT_UNITS.includes(draft.loadUnit);
  const weeklySeconds = weeklySecondsFromProtocol(body.protocol);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    setMessage(undefined);
    const parsed = editing
      ? updateReviewSchema.safeParse({ ...body, version: review!.version })
      : createReviewSchema.safeParse({ ...body, teamId: Number(draft.teamId) });
    if (!parsed.success) {
      setErrors(issuesToErrors(parsed.error.issues));
      setMessage('Some fields need another look; they are marked below.');
      focusFirstInvalid(form);
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      if (editing && onSubmitEdit) {
        const saved = await onSubmitEdit(body);
        onSaved?.(saved);
        setBusy(false);
        return;
      }
      const { review: created } = await apiFetch<{ review: ReviewDTO }>('/api/reviews', {
        method: 'POST',
        json: { ...body, teamId: Number(draft.teamId) },
      });
      void mutate(isReviewListKey);
      onSaved?.(created);
      router.push(`/reviews/${created.id}`);
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) setErrors(error.fieldErrors());
      focusFirstInvalid(form);
      setMessage(errorMessage(error));
      setBusy(false);
    }
  };

  return (
    <>
      <form
        onSubmit={submit}
        onChange={(e) => setErrors((current) => withoutFieldError(current, e.target))}
        noValidate
        className="space-y-6"
      >
        <FormMessage state={{ ok: false, message }} />

        <Section title="The claim" description="As it was made: one sentence, in the claim’s own terms.">
          {!editing && teams && teams.length > 1 && (
            <SelectField
              label="Team"
              {...field('teamId')}
              value={draft.teamId}
              onChange={(e) => set('teamId', e.target.value)}
              options={teams.map((t) => ({ value: String(t.id), label: t.name }))}
            />
          )}
          {!editing && teams && teams.length === 1 && <input type="hidden" name="teamId" value={draft.teamId} />}
          <TextAreaField
            label="Claim"
            {...field('claim')}
            rows={2}
            help="e.g. “Light daily hangs make fingers stronger.”"
            value={draft.claim}
            onChange={(e) => set('claim', e.target.value)}
            required
          />
          <TextField
            label="Who made it and where"
            {...field('claimSource')}
            help="A person, account or outlet, and the medium: “A climbing coach in a short video, March 2026”."
            value={draft.claimSource}
            onChange={(e) => set('claimSource', e.target.value)}
          />
          <TextField
            label="Link to the claim"
            {...field('claimUrl')}
            optional
            type="url"
            inputMode="url"
            placeholder="https://"
            value={draft.claimUrl}
            onChange={(e) => set('claimUrl', e.target.value)}
          />
          <TextField
            label="Review title"
            {...field('title')}
            optional
            help="Left empty, the claim is used as the title."
            value={draft.title}
            onChange={(e) => set('title', e.target.value)}
          />
        </Section>

        <Section
          title="The protocol"
          description="The dose the claim prescribes. Leave out what the claim does not say; unknowns count as unknown, not as zero."
        >
          <TextField
            label="Exercise"
            {...field('exercise', 'protocol.exercise')}
            help="e.g. “Half-crimp hang on a 20 mm edge”, “Back squat”."
            value={draft.exercise}
            onChange={(e) => set('exercise', e.target.value)}
          />
          <div className="grid gap-4 sm:grid-cols-[10rem_1fr]">
            <TextField
              label="Load"
              {...field('loadValue', 'protocol.loadValue')}
              optional
              inputMode="decimal"
              value={draft.loadValue}
              onChange={(e) => set('loadValue', e.target.value)}
            />
            <SelectField
              label="Unit of the load"
              {...field('loadUnit', 'protocol.loadUnit')}
              optional
              help={
                draft.loadUnit
                  ? LOAD_UNIT_HELP[draft.loadUnit]
                  : 'Every unit is converted to one scale: a fraction of the athlete’s maximum.'
              }
              value={draft.loadUnit}
              onChange={(e) => set('loadUnit', e.target.value as LoadUnit | '')}
              options={[
                { value: '', label: 'Choose a unit' },
                ...LOAD_UNITS.map((u) => ({ value: u, label: LOAD_UNIT_LABEL[u] })),
              ]}
            />
          </div>
          {bodyweightUnit && (
            <div className="border-line-strong grid gap-4 rounded-md border border-dashed px-4 py-3 sm:grid-cols-2">
              <p className="text-ink-muted text-sm sm:col-span-2">
                The reference athlete the claim has in mind, to turn a body-weight load into a share of their maximum.
              </p>
              <TextField
                label="Reference body weight (kg)"
                {...field('referenceBodyweightKg', 'protocol.referenceBodyweightKg')}
                inputMode="decimal"
                value={draft.referenceBodyweightKg}
                onChange={(e) => set('referenceBodyweightKg', e.target.value)}
              />
              <TextField
                label="Their maximum added load (kg)"
                {...field('referenceMaxAddedKg', 'protocol.referenceMaxAddedKg')}
                inputMode="decimal"
                help="The most they can add for this exercise; negative if they need assistance."
                value={draft.referenceMaxAddedKg}
                onChange={(e) => set('referenceMaxAddedKg', e.target.value)}
              />
            </div>
          )}
          <p
            className="bg-granite-50 text-granite-900 rounded-md px-3 py-2 text-sm"
            aria-live="polite"
            data-testid="intensity-preview"
          >
            {conversion
              ? conversion.intensity !== null
                ? `Intensity ${percent(conversion.intensity)} of maximum. ${conversion.explanation}`
                : conversion.explanation
              : 'Enter a load and its unit to see the intensity on the common scale.'}
          </p>
          <p className="text-ink-muted text-sm" aria-live="polite" data-testid="claim-time-under-load">
            {weeklySeconds !== null
              ? `Time under load: ${duration(weeklySeconds)} a week.`
              : 'Enter seconds per set, sets per session and sessions per day to see the time under load per week.'}
          </p>
          <div className="grid grid-cols-2 gap-4 lg:grid-cols-3">
            {SCHEDULE_FIELDS.map((f) => (
              <TextField
                key={f.key}
                label={f.label}
                help={f.help}
                {...field(f.key, `protocol.${f.key}`)}
                optional
                inputMode={f.inputMode}
                value={draft[f.key]}
                onChange={(e) => set(f.key, e.target.value)}
              />
            ))}
          </div>
          <SelectField
            label="Effort"
            {...field('effort', 'protocol.effort')}
            optional
            help="How hard each set feels at its end."
            value={draft.effort}
            onChange={(e) => set('effort', e.target.value as Effort | '')}
            options={[
              { value: '', label: 'Not stated' },
              ...EFFORTS.map((e) => ({ value: e, label: EFFORT_LABEL[e] })),
            ]}
          />
        </Section>

        <Section
          title="The claimed outcome"
          description="What the claim promises, measured the way studies measure it."
        >
          <DesirableField
            label="Which way is the claimed effect?"
            {...field('outcomeDesirable')}
            value={draft.outcomeDesirable}
            onChange={(value) => set('outcomeDesirable', value)}
          />
        </Section>

        <Section title="Who it is for" description="The people the claim promises the result to.">
          <SelectField
            label="Training status"
            {...field('status', 'population.status')}
            optional
            value={draft.status}
            onChange={(e) => set('status', e.target.value as TrainingStatus | '')}
            options={[
              { value: '', label: 'Not stated' },
              ...TRAINING_STATUSES.map((s) => ({ value: s, label: TRAINING_STATUS_LABEL[s] })),
            ]}
          />
          <CheckboxField
            label="Injured athletes (rehabilitation)"
            {...field('injured', 'population.injured')}
            checked={draft.injured}
            onChange={(e) => set('injured', e.target.checked)}
          />
          <TextField
            label="Tags"
            {...field('tags')}
            optional
            help="Comma-separated, e.g. fingers, tendon, hangboard."
            value={draft.tags}
            onChange={(e) => set('tags', e.target.value)}
          />
        </Section>

        <div className="flex flex-wrap gap-2">
          <Button type="submit" size="lg" disabled={busy} aria-busy={busy || undefined}>
            {busy && <Spinner />}
            {submitLabel ?? (editing ? 'Save claim and protocol' : 'Create review')}
          </Button>
          {onCancel && (
            <Button variant="secondary" size="lg" onClick={onCancel} disabled={busy}>
              Cancel
            </Button>
          )}
        </div>
      </form>
      {/* Past reviews of a similar claim, whose mechanisms can be reused once this one is created. */}
      {!editing && draft.teamId !== '' && <SimilarReviews teamId={Number(draft.teamId)} claim={draft.claim} />}
    </>
  );
}
