'use client';

import { useState, type FormEvent } from 'react';
import { Button } from '@/components/ui/Button';
import { CheckboxField, SelectField, TextField } from '@/components/ui/Field';
import { FormMessage } from '@/components/ui/FormMessage';
import { Spinner } from '@/components/ui/Spinner';
import { focusFirstInvalid, issuesToErrors, withoutFieldError } from '@/components/ui/form-errors';
import { DESIGN_LABEL, TRAINING_STATUS_LABEL } from '@/components/review/labels';
import { STUDY_DESIGNS, TRAINING_STATUSES, type EffectDataDTO, type StudyDTO } from '@/lib/reviews/types';
import { ApiError, apiFetch, errorMessage } from '@/lib/swr/fetcher';
import { updateStudySchema } from '@/lib/validation/studies';

type EffectKind = EffectDataDTO['kind'] | '';

const EFFECT_KIND_LABEL: Record<Exclude<EffectKind, ''>, string> = {
  means: 'Means, SDs and group sizes',
  t: 'An independent-samples t and group sizes',
  'two-by-two': 'A 2×2 table of counts',
  ready: 'A ready effect size and its variance',
};

const EFFECT_FIELDS: Record<Exclude<EffectKind, ''>, { key: string; label: string; help?: string }[]> = {
  means: [
    { key: 'm1', label: 'Mean, protocol group' },
    { key: 'sd1', label: 'SD, protocol group' },
    { key: 'n1', label: 'n, protocol group' },
    { key: 'm2', label: 'Mean, comparison group' },
    { key: 'sd2', label: 'SD, comparison group' },
    { key: 'n2', label: 'n, comparison group' },
  ],
  t: [
    { key: 't', label: 't statistic' },
    { key: 'n1', label: 'n, protocol group' },
    { key: 'n2', label: 'n, comparison group' },
  ],
  'two-by-two': [
    { key: 'a', label: 'a: protocol, event' },
    { key: 'b', label: 'b: protocol, no event' },
    { key: 'c', label: 'c: comparison, event' },
    { key: 'd', label: 'd: comparison, no event' },
  ],
  ready: [
    {
      key: 'effectSize',
      label: 'Effect size',
      help: 'The study’s difference between groups on the chosen scale; 0 means no difference.',
    },
    {
      key: 'variance',
      label: 'Variance of the effect size',
      help: 'Its standard error squared; smaller means more precise. Above 0.',
    },
  ],
};

const numberText = (v: unknown) => (typeof v === 'number' ? String(v) : '');
const num = (text: string) => (text.trim() === '' ? null : Number(text.trim().replace(',', '.')));

/**
 * What the appraisal needs from a study beyond its reference: design (certainty starts from
 * it), population and intensity (applicability compares them with the protocol), and the
 * effect data the meta-analysis pools. Percentages on screen, fractions in the request.
 */
export function StudyMetaForm({
  study,
  onSaved,
  onCancel,
}: {
  study: StudyDTO;
  onSaved: (study: StudyDTO) => void;
  onCancel: () => void;
}) {
  const effect = study.effect as (EffectDataDTO & Record<string, unknown>) | null;
  const [design, setDesign] = useState<string>(study.design ?? '');
  const [population, setPopulation] = useState<string>(study.population ?? '');
  const [injured, setInjured] = useState(study.injured);
  const [n, setN] = useState(numberText(study.n));
  const [intensity, setIntensity] = useState(
    study.intensity == null ? '' : String(Math.round(study.intensity * 1000) / 10),
  );
  const [durationWeeks, setDurationWeeks] = useState(numberText(study.durationWeeks));
  const [outcome, setOutcome] = useState(study.outcome ?? '');
  const [tags, setTags] = useState(study.tags.join(', '));
  const [kind, setKind] = useState<EffectKind>(effect?.kind ?? '');
  const [measure, setMeasure] = useState<string>(effect && 'measure' in effect ? String(effect.measure) : '');
  const [values, setValues] = useState<Record<string, string>>(() =>
    Object.fromEntries(Object.entries(effect ?? {}).map(([k, v]) => [k, numberText(v)])),
  );
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | undefined>();
  const [busy, setBusy] = useState(false);

  const buildEffect = () => {
    if (kind === '') return null;
    const out: Record<string, unknown> = { kind };
    for (const f of EFFECT_FIELDS[kind]) out[f.key] = num(values[f.key] ?? '') ?? Number.NaN;
    if (kind === 'two-by-two') out.measure = measure || 'risk-ratio';
    if (kind === 'ready') out.measure = measure || 'smd';
    return out;
  };

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const intensityNumber = num(intensity);
    const body = {
      design: design === '' ? null : design,
      population: population === '' ? null : population,
      injured,
      n: num(n),
      intensity: intensityNumber === null ? null : intensityNumber / 100,
      durationWeeks: num(durationWeeks),
      outcome: outcome.trim() === '' ? null : outcome,
      effect: buildEffect(),
      tags: tags
        .split(',')
        .map((t) => t.trim())
        .filter(Boolean),
    };
    const parsed = updateStudySchema.safeParse(body);
    if (!parsed.success) {
      setErrors(issuesToErrors(parsed.error.issues));
      setMessage('Check the fields marked below.');
      focusFirstInvalid(form);
      return;
    }
    setErrors({});
    setMessage(undefined);
    setBusy(true);
    try {
      const { study: saved } = await apiFetch<{ study: StudyDTO }>(`/api/studies/${study.id}`, {
        method: 'PATCH',
        json: body,
      });
      onSaved(saved);
    } catch (error) {
      if (error instanceof ApiError && error.issues.length) setErrors(error.fieldErrors());
      focusFirstInvalid(form);
      setMessage(errorMessage(error));
      setBusy(false);
    }
  };

  return (
    <form
      onSubmit={submit}
      onChange={(e) => setErrors((current) => withoutFieldError(current, e.target))}
      noValidate
      className="space-y-5"
    >
      <FormMessage state={{ ok: false, message }} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Design"
          name="design"
          optional
          help="Certainty starts from it."
          value={design}
          onChange={(e) => setDesign(e.target.value)}
          options={[
            { value: '', label: 'Not recorded' },
            ...STUDY_DESIGNS.map((d) => ({ value: d, label: DESIGN_LABEL[d] })),
          ]}
          errors={errors.design}
        />
        <SelectField
          label="Participants’ training status"
          name="population"
          optional
          value={population}
          onChange={(e) => setPopulation(e.target.value)}
          options={[
            { value: '', label: 'Not recorded' },
            ...TRAINING_STATUSES.map((s) => ({ value: s, label: TRAINING_STATUS_LABEL[s] })),
          ]}
          errors={errors.population}
        />
        <TextField
          label="Participants (n)"
          name="n"
          optional
          inputMode="numeric"
          value={n}
          onChange={(e) => setN(e.target.value)}
          errors={errors.n}
        />
        <TextField
          label="Intensity (% of maximum)"
          name="intensity"
          optional
          inputMode="decimal"
          help="The load the study used, on the protocol’s scale."
          value={intensity}
          onChange={(e) => setIntensity(e.target.value)}
          errors={errors.intensity}
        />
        <TextField
          label="Duration (weeks)"
          name="durationWeeks"
          optional
          inputMode="decimal"
          value={durationWeeks}
          onChange={(e) => setDurationWeeks(e.target.value)}
          errors={errors.durationWeeks}
        />
        <TextField
          label="Outcome measured"
          name="outcome"
          optional
          value={outcome}
          onChange={(e) => setOutcome(e.target.value)}
          errors={errors.outcome}
        />
      </div>
      <CheckboxField
        label="Injured participants"
        name="injured"
        checked={injured}
        onChange={(e) => setInjured(e.target.checked)}
      />
      <TextField
        label="Tags"
        name="tags"
        optional
        help="Comma-separated."
        value={tags}
        onChange={(e) => setTags(e.target.value)}
        errors={errors.tags}
      />

      <fieldset className="border-line space-y-4 rounded-md border px-4 pt-2 pb-4">
        <legend className="px-1 text-sm font-semibold">Effect data</legend>
        <SelectField
          label="As reported"
          name="effect.kind"
          optional
          help="The app computes a comparable effect size from it for the meta-analysis."
          value={kind}
          onChange={(e) => setKind(e.target.value as EffectKind)}
          options={[
            { value: '', label: 'None recorded' },
            ...Object.entries(EFFECT_KIND_LABEL).map(([value, label]) => ({ value, label })),
          ]}
          errors={errors.effect ?? errors['effect.kind']}
        />
        {kind !== '' && (
          <div className="grid gap-4 sm:grid-cols-3">
            {EFFECT_FIELDS[kind].map((f) => (
              <TextField
                key={f.key}
                label={f.label}
                help={f.help}
                name={`effect.${f.key}`}
                inputMode="decimal"
                value={values[f.key] ?? ''}
                onChange={(e) => setValues((v) => ({ ...v, [f.key]: e.target.value }))}
                errors={errors[`effect.${f.key}`]}
              />
            ))}
            {(kind === 'two-by-two' || kind === 'ready') && (
              <SelectField
                label="Measure"
                name="effect.measure"
                value={measure || (kind === 'two-by-two' ? 'risk-ratio' : 'smd')}
                onChange={(e) => setMeasure(e.target.value)}
                options={
                  kind === 'two-by-two'
                    ? [
                        { value: 'risk-ratio', label: 'Risk ratio' },
                        { value: 'odds-ratio', label: 'Odds ratio' },
                      ]
                    : [
                        { value: 'smd', label: 'Standardized mean difference' },
                        { value: 'log-risk-ratio', label: 'Log risk ratio' },
                        { value: 'log-odds-ratio', label: 'Log odds ratio' },
                      ]
                }
                errors={errors['effect.measure']}
              />
            )}
          </div>
        )}
      </fieldset>

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={busy} aria-busy={busy || undefined}>
          {busy && <Spinner />}
          Save study details
        </Button>
        <Button variant="secondary" onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
