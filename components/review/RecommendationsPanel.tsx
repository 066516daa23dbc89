'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/Button';
import { FormMessage } from '@/components/ui/FormMessage';
import { SafetyNotice } from '@/components/ui/SafetyNotice';
import { Spinner } from '@/components/ui/Spinner';
import type { RecommendationsDTO, ReviewDTO } from '@/lib/reviews/types';
import { ApiError, errorMessage } from '@/lib/swr/fetcher';
import { TextAreaField } from '@/components/ui/Field';
import { focusFirstInvalid, issuesToErrors } from '@/components/ui/form-errors';

const FIELDS: { key: keyof RecommendationsDTO; label: string; help: string }[] = [
  {
    key: 'whoMightTry',
    label: 'Who might try it',
    help: 'The athletes for whom the protocol is reasonable, and how to start.',
  },
  {
    key: 'whoShouldNot',
    label: 'Who should not',
    help: 'Injuries, stages of training or situations where it does more harm than good.',
  },
  {
    key: 'whatInstead',
    label: 'What to do instead',
    help: 'A better-supported way to the same result, if there is one.',
  },
];

/**
 * The advice the review ends with, per audience. Saved on request (not on every keystroke),
 * through the review's shared saver so its version stays in step with the body's autosave; a
 * refused save keeps the text in the fields. The safety cautions sit right above the fields.
 */
export function RecommendationsPanel({
  review,
  canEdit,
  onSave,
}: {
  review: ReviewDTO;
  canEdit: boolean;
  onSave: (recommendations: RecommendationsDTO) => Promise<unknown>;
}) {
  const [draft, setDraft] = useState<RecommendationsDTO>(review.recommendations);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [state, setState] = useState<{ ok?: boolean; message?: string }>({});
  const [busy, setBusy] = useState(false);
  const changed = FIELDS.some((f) => draft[f.key] !== review.recommendations[f.key]);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    // The schema (and zod with it) is fetched on the first save, not with the page.
    const { recommendationsSchema } = await import('@/lib/validation/reviews');
    const parsed = recommendationsSchema.safeParse(draft);
    if (!parsed.success) {
      setErrors(issuesToErrors(parsed.error.issues));
      setState({ ok: false, message: 'Check the fields marked below.' });
      focusFirstInvalid(form);
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      await onSave(parsed.data);
      setState({ ok: true, message: 'Recommendations saved.' });
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) setErrors(error.fieldErrors());
      setState({
        ok: false,
        message:
          error instanceof ApiError && error.status === 409
            ? 'Someone else changed this review since you opened it. Your text is still here: copy it, reload the page, and save again.'
            : errorMessage(error),
      });
      focusFirstInvalid(form);
    } finally {
      setBusy(false);
    }
  };

  return (
    <section
      aria-labelledby="recommendations-title"
      className="border-line bg-paper-raised shadow-card rounded-lg border"
    >
      <div className="border-line border-b px-5 py-3">
        <h2 id="recommendations-title" className="text-lg font-semibold">
          Recommendations
        </h2>
        <p className="text-ink-muted text-sm">What the review advises, in words an athlete can act on.</p>
      </div>
      <div className="space-y-4 px-5 py-4">
        <SafetyNotice />
        {canEdit ? (
          <form onSubmit={submit} noValidate className="space-y-4">
            <FormMessage state={state} />
            {FIELDS.map((f) => (
              <TextAreaField
                key={f.key}
                label={f.label}
                name={`recommendations.${f.key}`}
                help={f.help}
                optional
                rows={3}
                value={draft[f.key]}
                onChange={(e) => {
                  setDraft((d) => ({ ...d, [f.key]: e.target.value }));
                  setState({});
                }}
                errors={errors[f.key] ?? errors[`recommendations.${f.key}`]}
              />
            ))}
            <div className="flex flex-wrap items-center gap-3">
              <Button type="submit" disabled={busy || !changed} aria-busy={busy || undefined}>
                {busy && <Spinner />}
                Save recommendations
              </Button>
              {/* Beside the button, where the eye is after clicking: a greyed button alone says nothing. */}
              <span
                role="status"
                className={changed ? 'text-ink-muted text-sm' : 'text-success-700 text-sm font-semibold'}
                data-testid="recommendations-saved"
              >
                {state.ok && !changed ? '✓ Saved' : !changed ? '' : 'Unsaved changes'}
              </span>
            </div>
          </form>
        ) : (
          <dl className="space-y-3 text-sm">
            {FIELDS.map((f) => (
              <div key={f.key}>
                <dt className="font-semibold">{f.label}</dt>
                <dd className="text-ink-muted whitespace-pre-line">
                  {review.recommendations[f.key] || 'Not written yet.'}
                </dd>
              </div>
            ))}
          </dl>
        )}
      </div>
    </section>
  );
}
