'use client';

import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { CONTRIBUTIONS, CONTRIBUTION_LABEL, type RatingDTO, type ScorecardViewDTO } from '@/lib/rounds/types';
import { BandPicker } from '../BandPicker';
import { ChoiceChips } from './ChoiceChips';
import { EvidenceList } from './EvidenceList';

const percent = (x: number | null) => (x === null ? null : `${Math.round(x * 100)} %`);

/** One mechanism to score: the author's case for it, then a band, a contribution and a comment. */
export function MechanismScoreCard({
  mechanism: m,
  index,
  rating,
  evidence,
  studyById,
  errors,
  locked,
  onChange,
}: {
  mechanism: ScorecardViewDTO['mechanisms'][number];
  index: number;
  rating: RatingDTO;
  evidence: ScorecardViewDTO['appraisals'];
  studyById: Map<number, ScorecardViewDTO['studies'][number]>;
  errors: Record<string, string>;
  locked: boolean;
  onChange: (patch: Partial<RatingDTO>) => void;
}) {
  return (
    <Card id={`mechanism-${m.id}`} aria-labelledby={`mechanism-title-${m.id}`} className="scroll-mt-24">
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
          onChange={(band) => onChange({ band })}
          error={errors[`mechanism.${m.id}.band`]}
          disabled={locked}
        />
        <fieldset disabled={locked} aria-invalid={errors[`mechanism.${m.id}.contribution`] ? true : undefined}>
          <legend className="mb-2 text-sm font-semibold">If it works, how much does it contribute?</legend>
          <ChoiceChips
            name={`contribution-${m.id}`}
            choices={CONTRIBUTIONS}
            label={(c) => CONTRIBUTION_LABEL[c]}
            value={rating.contribution}
            onChange={(contribution) => onChange({ contribution })}
          />
          {errors[`mechanism.${m.id}.contribution`] && (
            <p className="text-danger-700 mt-1.5 text-sm font-medium">{errors[`mechanism.${m.id}.contribution`]}</p>
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
            onChange={(e) => onChange({ comment: e.target.value })}
            className="border-line-strong bg-paper-raised read-only:bg-paper-sunken mt-1 block w-full rounded-md border px-3 py-2"
          />
        </div>
      </CardBody>
    </Card>
  );
}
