'use client';

import Link from 'next/link';
import { useMemo, useState, type FormEvent } from 'react';
import { FormFooter } from '@/components/review/FormFooter';
import { Button } from '@/components/ui/Button';
import { CheckboxField, RadioGroupField, SelectField, TextAreaField, TextField } from '@/components/ui/Field';
import { FormMessage } from '@/components/ui/FormMessage';
import { StudyCombobox } from '@/components/library/StudyCombobox';
import { issuesToErrors } from '@/components/ui/form-errors';
import { useDialogForm } from '@/components/review/useDialogForm';
import { DESIGN_LABEL, DIRECTION_LABEL, percent, TRAINING_STATUS_LABEL } from '@/components/review/labels';
import {
  CONCERNS,
  DIRECTIONS,
  type AppraisalDTO,
  type Concern,
  type Direction,
  type MechanismDTO,
  type ReviewDTO,
  type StudyDTO,
} from '@/lib/reviews/types';
import { explainApplicability, type ApplicabilityExplanation } from '@/lib/scoring/applicability';
import {
  CONCERN_INFO,
  DOMAIN_INFO,
  DOWNGRADE_DOMAINS,
  gradingFields,
  LARGE_EFFECT_INFO,
  LARGE_EFFECTS,
  perDomain,
  type GradingFields,
  type LargeEffect,
} from '@/lib/scoring/appraisal-vocabulary';
import { gradeCertainty, type CertaintyResult } from '@/lib/scoring/certainty';
import { errorMessage } from '@/lib/swr/fetcher';
import { appraisalSchema, type AppraisalInput } from '@/lib/validation/appraisals';
import { directionReasonIssue, suggestedDirectionFor } from '@/lib/reviews/direction-check';
import { targetDesirable } from '@/lib/reviews/meta';
import { CertaintyWorking } from './CertaintyWorking';
import { DirectionSuggestion } from './DirectionSuggestion';
import { NeedsCheckNotice } from './NeedsCheck';

type Draft = GradingFields & {
  studyId: number | null;
  mechanismId: number | null;
  direction: Direction;
  override: boolean;
  /** Percent as typed. */
  applicabilityOverride: string;
  overrideReason: string;
  directionReason: string;
  notes: string;
};

const fromAppraisal = (a: AppraisalDTO | undefined, mechanismId: number | null): Draft => ({
  studyId: a?.studyId ?? null,
  mechanismId: a ? a.mechanismId : mechanismId,
  direction: a?.direction ?? 'supports',
  ...perDomain((d) => a?.[d] ?? 'none'),
  largeEffect: a?.largeEffect ?? 0,
  doseResponse: a?.doseResponse ?? false,
  confoundingWouldReduce: a?.confoundingWouldReduce ?? false,
  override: a?.applicabilityOverride != null,
  applicabilityOverride:
    a?.applicabilityOverride != null ? String(Math.round(a.applicabilityOverride * 1000) / 10) : '',
  overrideReason: a?.overrideReason ?? '',
  directionReason: a?.directionReason ?? '',
  notes: a?.notes ?? '',
});

/** Runs a pure scoring function on what the form holds; an input it refuses is shown, not thrown. */
function attempt<T>(fn: () => T): { value: T; error: null } | { value: null; error: string } {
  try {
    return { value: fn(), error: null };
  } catch (error) {
    return { value: null, error: errorMessage(error) };
  }
}

/**
 * One study against one mechanism (or the claimed outcome): which way it points, the five
 * certainty domains and the upgrades. Certainty is regraded on every change with the same
 * function the server uses, with its steps, and the suggested applicability is shown with its
 * reasons; the coach may override it with a written reason.
 */
export function AppraisalForm({
  review,
  mechanisms,
  library,
  libraryLoading,
  appraisal,
  defaultMechanismId,
  appraisals,
  onSubmit,
  onDelete,
  onCancel,
}: {
  review: ReviewDTO;
  mechanisms: readonly MechanismDTO[];
  library: readonly StudyDTO[];
  libraryLoading: boolean;
  appraisal?: AppraisalDTO;
  defaultMechanismId: number | null;
  /** The review's appraisals: a study already appraised for the chosen target is not offered again. */
  appraisals: readonly AppraisalDTO[];
  onSubmit: (input: AppraisalInput) => Promise<unknown>;
  onDelete?: () => Promise<unknown>;
  onCancel: () => void;
}) {
  const [draft, setDraft] = useState<Draft>(() => fromAppraisal(appraisal, defaultMechanismId));
  const [picking, setPicking] = useState(!appraisal);
  const { errors, message, busy, refuse, save, remove, clearChanged } = useDialogForm({ onSubmit, onDelete });
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  const study = useMemo(() => library.find((s) => s.id === draft.studyId), [library, draft.studyId]);
  const usedStudyIds = useMemo(
    () =>
      new Set(
        appraisals.filter((a) => a.mechanismId === draft.mechanismId && a.id !== appraisal?.id).map((a) => a.studyId),
      ),
    [appraisals, draft.mechanismId, appraisal?.id],
  );

  const suggested = useMemo(() => {
    const target = mechanisms.find((m) => m.id === draft.mechanismId) ?? null;
    return study ? suggestedDirectionFor(study.effect, targetDesirable(target, review.outcomeDesirable)) : null;
  }, [study, mechanisms, draft.mechanismId, review.outcomeDesirable]);
  const needsReason = suggested !== null && suggested !== draft.direction;

  const certainty = useMemo(() => {
    if (!study?.design) return null;
    const design = study.design;
    return attempt<CertaintyResult>(() => gradeCertainty({ design, ...gradingFields(draft) }));
  }, [study, draft]);

  const applicability = useMemo(() => {
    if (!study) return null;
    return attempt<ApplicabilityExplanation>(() =>
      explainApplicability({
        studyPopulation: study.population ?? undefined,
        targetPopulation: review.population.status ?? undefined,
        studyInjured: study.injured,
        targetInjured: review.population.injured,
        studyIntensity: study.intensity ?? undefined,
        protocolIntensity: review.protocol.intensity ?? undefined,
      }),
    );
  }, [study, review.population, review.protocol.intensity]);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const overrideNumber =
      draft.applicabilityOverride.trim() === '' ? Number.NaN : Number(draft.applicabilityOverride.replace(',', '.'));
    const candidate = {
      studyId: draft.studyId ?? 0,
      mechanismId: draft.mechanismId,
      direction: draft.direction,
      ...gradingFields(draft),
      applicabilityOverride: draft.override ? overrideNumber / 100 : null,
      overrideReason: draft.override ? draft.overrideReason : null,
      directionReason: needsReason ? draft.directionReason : null,
      notes: draft.notes,
    };
    const parsed = appraisalSchema.safeParse(candidate);
    const reasonIssue = directionReasonIssue({ ...candidate, suggested });
    if (!parsed.success || reasonIssue) {
      const found = issuesToErrors([...(parsed.error?.issues ?? []), ...(reasonIssue ? [reasonIssue] : [])]);
      refuse(form, found, found.studyId ? 'Pick a study from the library first.' : undefined);
      return;
    }
    await save(form, parsed.data);
  };

  return (
    <form onSubmit={submit} onChange={clearChanged} noValidate className="space-y-6">
      <FormMessage state={{ ok: false, message }} />
      {appraisal?.needsCheck && <NeedsCheckNotice />}

      <section className="space-y-3" aria-labelledby="appraisal-study">
        <h3 id="appraisal-study" className="text-base font-semibold">
          Study
        </h3>
        {study && !picking ? (
          <div className="border-line bg-paper-sunken/60 flex flex-wrap items-start justify-between gap-3 rounded-md border px-4 py-3">
            <div className="min-w-0 text-sm">
              <p className="font-semibold" data-testid="appraisal-study">
                {study.citation}
              </p>
              <p className="text-ink-muted">{study.title}</p>
              <p className="text-ink-muted text-xs">
                {[
                  study.design ? DESIGN_LABEL[study.design] : 'Design not recorded',
                  study.population ? TRAINING_STATUS_LABEL[study.population] : null,
                  study.injured ? 'injured' : null,
                  study.n ? `n = ${study.n}` : null,
                  study.intensity != null ? `${percent(study.intensity)} of max` : null,
                ]
                  .filter(Boolean)
                  .join(' · ')}
              </p>
            </div>
            {!appraisal && (
              <Button variant="secondary" size="sm" onClick={() => setPicking(true)}>
                Change study
              </Button>
            )}
          </div>
        ) : (
          <StudyCombobox
            studies={library}
            loading={libraryLoading}
            excludeIds={usedStudyIds}
            label="Pick a study from the library"
            autoFocus
            onPick={(s) => {
              set('studyId', s.id);
              setPicking(false);
            }}
          />
        )}
        {errors.studyId && <p className="text-danger-700 text-sm font-medium">{errors.studyId[0]}</p>}
        <input type="hidden" name="studyId" value={draft.studyId ?? ''} />
      </section>

      <SelectField
        label="What does it test?"
        name="mechanismId"
        value={draft.mechanismId === null ? 'outcome' : String(draft.mechanismId)}
        onChange={(e) => set('mechanismId', e.target.value === 'outcome' ? null : Number(e.target.value))}
        options={[
          { value: 'outcome', label: 'The claimed outcome itself' },
          ...mechanisms.map((m) => ({ value: String(m.id), label: `Mechanism: ${m.name}` })),
        ]}
        errors={errors.mechanismId}
      />

      <RadioGroupField
        legend="Direction"
        name="direction"
        value={draft.direction}
        onChange={(v) => set('direction', v)}
        options={DIRECTIONS.map((d) => ({ value: d, label: DIRECTION_LABEL[d] }))}
        errors={errors.direction}
      />
      {study && (
        <DirectionSuggestion
          suggested={suggested}
          direction={draft.direction}
          reason={draft.directionReason}
          onUse={(d) => set('direction', d)}
          onReason={(r) => set('directionReason', r)}
          errors={errors.directionReason}
        />
      )}

      <div className="grid gap-6 lg:grid-cols-2">
        <fieldset className="space-y-4">
          <legend className="text-base font-semibold">Certainty: reasons to rate down</legend>
          {DOWNGRADE_DOMAINS.map((d) => (
            <SelectField
              key={d}
              label={DOMAIN_INFO[d].label}
              name={d}
              help={DOMAIN_INFO[d].help}
              value={draft[d]}
              onChange={(e) => set(d, e.target.value as Concern)}
              options={CONCERNS.map((c) => ({ value: c, label: CONCERN_INFO[c].label }))}
              errors={errors[d]}
            />
          ))}
          <p className="pt-1 text-base font-semibold">Reasons to rate up</p>
          <p className="text-ink-muted -mt-3 text-sm">
            They count only for evidence that starts low and was not rated down.
          </p>
          <SelectField
            label="Large effect"
            name="largeEffect"
            value={String(draft.largeEffect)}
            onChange={(e) => set('largeEffect', Number(e.target.value) as LargeEffect)}
            options={LARGE_EFFECTS.map((n) => ({ value: String(n), label: LARGE_EFFECT_INFO[n].label }))}
            errors={errors.largeEffect}
          />
          <CheckboxField
            label="Dose–response gradient (+1)"
            name="doseResponse"
            checked={draft.doseResponse}
            onChange={(e) => set('doseResponse', e.target.checked)}
          />
          <CheckboxField
            label="Plausible confounding would have shrunk the effect (+1)"
            name="confoundingWouldReduce"
            checked={draft.confoundingWouldReduce}
            onChange={(e) => set('confoundingWouldReduce', e.target.checked)}
          />
        </fieldset>

        {/* Stays in view while the domains on the left are changed (the dialog scrolls). */}
        <div className="space-y-4 lg:sticky lg:top-24 lg:self-start">
          <section
            aria-live="polite"
            aria-label="Certainty, recomputed"
            className="border-line bg-paper-sunken/60 space-y-2 rounded-md border px-4 py-3"
          >
            {!study ? (
              <p className="text-ink-muted text-sm">Pick a study to see its certainty.</p>
            ) : !study.design ? (
              <p className="text-ink-muted text-sm">
                This study has no design recorded, so its certainty cannot be graded.{' '}
                <Link href={`/library/${study.id}`} className="prose-link" target="_blank">
                  Record it in the library
                </Link>
                .
              </p>
            ) : certainty?.error ? (
              <p className="text-danger-700 text-sm">{certainty.error}</p>
            ) : certainty?.value ? (
              <CertaintyWorking result={certainty.value} />
            ) : null}
          </section>

          <section
            aria-label="Applicability"
            className="border-line bg-paper-sunken/60 space-y-3 rounded-md border px-4 py-3"
          >
            <p className="flex flex-wrap items-baseline gap-x-2">
              <span className="text-ink-muted text-sm">Suggested applicability</span>
              <span className="text-xl font-semibold tabular-nums" data-testid="suggested-applicability">
                {applicability?.value ? percent(applicability.value.applicability) : '—'}
              </span>
            </p>
            {applicability?.value ? (
              <ul className="text-ink-muted list-disc space-y-1 pl-5 text-sm">
                <li>{applicability.value.populationReason}</li>
                <li>{applicability.value.doseReason}</li>
              </ul>
            ) : applicability?.error ? (
              <p className="text-danger-700 text-sm">{applicability.error}</p>
            ) : (
              <p className="text-ink-muted text-sm">Pick a study to see how well it speaks to this protocol.</p>
            )}
            <CheckboxField
              label="Set applicability by hand"
              name="override"
              checked={draft.override}
              onChange={(e) => set('override', e.target.checked)}
            />
            {draft.override && (
              <div className="space-y-3">
                <TextField
                  label="Applicability (%)"
                  name="applicabilityOverride"
                  inputMode="decimal"
                  help="0 = says nothing about this protocol, 100 = speaks to it directly."
                  value={draft.applicabilityOverride}
                  onChange={(e) => set('applicabilityOverride', e.target.value)}
                  errors={errors.applicabilityOverride}
                />
                <TextAreaField
                  label="Why you override the suggestion"
                  name="overrideReason"
                  rows={2}
                  value={draft.overrideReason}
                  onChange={(e) => set('overrideReason', e.target.value)}
                  errors={errors.overrideReason}
                  required
                />
              </div>
            )}
          </section>
        </div>
      </div>

      <TextAreaField
        label="Notes"
        name="notes"
        optional
        rows={3}
        value={draft.notes}
        onChange={(e) => set('notes', e.target.value)}
        errors={errors.notes}
      />

      <FormFooter
        busy={busy}
        saveLabel="Save appraisal"
        deleteLabel="Delete appraisal"
        deleteQuestion="Delete this appraisal?"
        onCancel={onCancel}
        onDelete={onDelete ? () => void remove() : undefined}
      />
    </form>
  );
}
