'use client';

import { useState, type FormEvent } from 'react';
import { FormFooter } from './FormFooter';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/Field';
import { FormMessage } from '@/components/ui/FormMessage';
import {
  EFFORTS,
  MAGNITUDES,
  MECHANISM_KINDS,
  type Effort,
  type Magnitude,
  type MechanismDTO,
  type MechanismKind,
  type ProtocolDTO,
} from '@/lib/reviews/types';
import { likelihoodTerm } from '@/lib/scoring/likelihood';
import type { MechanismInput } from '@/lib/swr/use-review-mutations';
import { mechanismSchema } from '@/lib/validation/reviews';
import { issuesToErrors } from '@/components/ui/form-errors';
import type { Desirable } from '@/lib/scoring/direction';
import { DesirableField } from './DesirableField';
import { useDialogForm } from './useDialogForm';
import { EFFORT_LABEL, MAGNITUDE_LABEL, MECHANISM_KIND_HELP, MECHANISM_KIND_LABEL, percent } from './labels';

interface Draft {
  name: string;
  kind: MechanismKind;
  summary: string;
  /** Percent of maximum as typed; '' = no minimum. */
  minIntensity: string;
  minEffort: Effort | '';
  /** Percent as typed. */
  prior: string;
  magnitude: Magnitude;
  stated: boolean;
  desirable: Desirable;
}

const fromMechanism = (m?: MechanismDTO): Draft => ({
  name: m?.name ?? '',
  kind: m?.kind ?? 'physiological',
  summary: m?.summary ?? '',
  minIntensity: m?.minIntensity == null ? '' : String(Math.round(m.minIntensity * 1000) / 10),
  minEffort: m?.minEffort ?? '',
  prior: String(Math.round((m?.prior ?? 0.5) * 1000) / 10),
  magnitude: m?.magnitude ?? 'moderate',
  stated: m?.stated ?? false,
  desirable: m?.desirable ?? 'higher',
});

const toNumber = (text: string): number | null => (text.trim() === '' ? null : Number(text.replace(',', '.')));

/**
 * A candidate mechanism: what it is, what stimulus it needs (minimum intensity and effort, which
 * the dose check compares with the protocol), how plausible it is before any evidence, how big
 * its effect would be, and whether the claim names it as its reason. Percentages on screen,
 * fractions in the request (docs/scoring.md: fractions everywhere).
 */
export function MechanismForm({
  mechanism,
  protocol,
  onSubmit,
  onDelete,
  onCancel,
}: {
  mechanism?: MechanismDTO;
  protocol: ProtocolDTO;
  onSubmit: (input: MechanismInput) => Promise<unknown>;
  onDelete?: () => Promise<unknown>;
  onCancel: () => void;
}) {
  const [draft, setDraft] = useState<Draft>(() => fromMechanism(mechanism));
  const { errors, message, busy, refuse, save, remove, clearChanged } = useDialogForm<MechanismInput>({
    onSubmit,
    onDelete,
  });
  const set = <K extends keyof Draft>(key: K, value: Draft[K]) => setDraft((d) => ({ ...d, [key]: value }));

  const priorNumber = toNumber(draft.prior);
  const priorTerm =
    priorNumber !== null && Number.isFinite(priorNumber) && priorNumber > 0 && priorNumber < 100
      ? likelihoodTerm(priorNumber / 100)
      : null;

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const form = event.currentTarget as HTMLFormElement;
    const minIntensity = toNumber(draft.minIntensity);
    const prior = toNumber(draft.prior);
    const candidate = {
      name: draft.name,
      kind: draft.kind,
      summary: draft.summary,
      minIntensity: minIntensity === null ? null : minIntensity / 100,
      minEffort: draft.minEffort === '' ? null : draft.minEffort,
      prior: prior === null ? Number.NaN : prior / 100,
      magnitude: draft.magnitude,
      stated: draft.stated,
      desirable: draft.desirable,
    };
    const parsed = mechanismSchema.safeParse(candidate);
    if (!parsed.success) {
      refuse(form, issuesToErrors(parsed.error.issues));
      return;
    }
    const { position: _position, ...input } = parsed.data;
    await save(form, input);
  };

  const percentHelp = (fraction: number | null) => (fraction === null ? 'not recorded' : percent(fraction));

  return (
    <form onSubmit={submit} onChange={clearChanged} noValidate className="space-y-5">
      <FormMessage state={{ ok: false, message }} />
      <TextField
        label="Name"
        name="name"
        value={draft.name}
        onChange={(e) => set('name', e.target.value)}
        errors={errors.name}
        placeholder="e.g. Tendon stiffness"
        autoFocus
      />
      <SelectField
        label="Kind"
        name="kind"
        help={MECHANISM_KIND_HELP[draft.kind]}
        value={draft.kind}
        onChange={(e) => set('kind', e.target.value as MechanismKind)}
        options={MECHANISM_KINDS.map((k) => ({ value: k, label: MECHANISM_KIND_LABEL[k] }))}
        errors={errors.kind}
      />
      <TextAreaField
        label="How it would work"
        name="summary"
        optional
        rows={3}
        value={draft.summary}
        onChange={(e) => set('summary', e.target.value)}
        errors={errors.summary}
      />
      <fieldset className="border-line space-y-4 rounded-md border px-4 pt-2 pb-4">
        <legend className="px-1 text-sm font-semibold">Stimulus it needs</legend>
        <p className="text-ink-muted text-sm">
          The protocol runs at {percentHelp(protocol.intensity)} of maximum, effort{' '}
          {protocol.effort ? EFFORT_LABEL[protocol.effort].toLowerCase() : 'not recorded'}. Leave a minimum empty when
          the mechanism does not need one.
        </p>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="Minimum intensity (% of maximum)"
            name="minIntensity"
            optional
            inputMode="decimal"
            value={draft.minIntensity}
            onChange={(e) => set('minIntensity', e.target.value)}
            errors={errors.minIntensity}
            placeholder="e.g. 70"
          />
          <SelectField
            label="Minimum effort"
            name="minEffort"
            optional
            value={draft.minEffort}
            onChange={(e) => set('minEffort', e.target.value as Effort | '')}
            options={[
              { value: '', label: 'No minimum' },
              ...EFFORTS.map((e) => ({ value: e, label: EFFORT_LABEL[e] })),
            ]}
            errors={errors.minEffort}
          />
        </div>
      </fieldset>
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Prior plausibility (%)"
          name="prior"
          inputMode="decimal"
          help={
            priorTerm ? `Before any evidence: ${priorTerm}.` : 'Above 0 and below 100; 50 means no leaning either way.'
          }
          value={draft.prior}
          onChange={(e) => set('prior', e.target.value)}
          errors={errors.prior}
        />
        <SelectField
          label="Size of its effect if it works"
          name="magnitude"
          value={draft.magnitude}
          onChange={(e) => set('magnitude', e.target.value as Magnitude)}
          options={MAGNITUDES.map((m) => ({ value: m, label: MAGNITUDE_LABEL[m] }))}
          errors={errors.magnitude}
        />
      </div>
      <CheckboxField
        label="The claim names this as its reason"
        name="stated"
        help="The verdict asks whether a stated mechanism holds up, not only whether the outcome does."
        checked={draft.stated}
        onChange={(e) => set('stated', e.target.checked)}
        errors={errors.stated}
      />
      <DesirableField
        label="Which way does its measure move when it works?"
        name="desirable"
        value={draft.desirable}
        onChange={(value) => set('desirable', value)}
        errors={errors.desirable}
      />

      <FormFooter
        busy={busy}
        saveLabel="Save mechanism"
        deleteLabel="Delete mechanism"
        deleteQuestion="Delete it and its appraisals?"
        onCancel={onCancel}
        onDelete={onDelete ? () => void remove() : undefined}
      />
    </form>
  );
}
