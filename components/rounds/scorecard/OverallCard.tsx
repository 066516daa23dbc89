'use client';

import { LocalTime } from '@/components/review/LocalTime';
import { Button } from '@/components/ui/Button';
import { Card, CardBody, CardHeader } from '@/components/ui/Card';
import { SIGN_OFFS, SIGN_OFF_LABEL } from '@/lib/rounds/types';
import type { SaveState, useScorecardDraft } from '@/lib/swr/use-scorecard-draft';
import { ChoiceChips } from './ChoiceChips';

/** The overall comment, the sign-off, and submitting (with a confirmation: it is final). */
export function OverallCard({ draft }: { draft: ReturnType<typeof useScorecardDraft> }) {
  const { overall, signOff, locked, errors, confirming, submitting, submitError, save } = draft;
  return (
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
            onChange={(e) => draft.setOverall(e.target.value)}
            className="border-line-strong bg-paper-raised read-only:bg-paper-sunken mt-1 block w-full rounded-md border px-3 py-2"
          />
        </div>
        <fieldset disabled={locked} aria-invalid={errors.signOff ? true : undefined}>
          <legend className="mb-2 text-sm font-semibold">Your sign-off</legend>
          <ChoiceChips
            name="signOff"
            choices={SIGN_OFFS}
            label={(s) => SIGN_OFF_LABEL[s]}
            value={signOff}
            onChange={draft.setSignOff}
            selectedClassName={(s) =>
              s === 'do-not-publish'
                ? 'border-danger-700 bg-danger-700 text-white'
                : 'border-granite-700 bg-granite-700 text-white'
            }
          />
          {errors.signOff && <p className="text-danger-700 mt-1.5 text-sm font-medium">{errors.signOff}</p>}
        </fieldset>

        {!locked && (
          <div className="border-line flex flex-wrap items-center gap-3 border-t pt-4">
            {!confirming ? (
              <Button onClick={draft.askToSubmit}>Submit scorecard</Button>
            ) : (
              <div role="group" aria-label="Confirm submission" className="flex flex-wrap items-center gap-2">
                <span className="text-sm font-semibold">Submit now? You cannot change your scores afterwards.</span>
                <Button onClick={draft.submit} disabled={submitting}>
                  {submitting ? 'Submitting…' : 'Yes, submit'}
                </Button>
                <Button variant="ghost" onClick={() => draft.setConfirming(false)}>
                  Not yet
                </Button>
              </div>
            )}
            <SaveStatus state={save} onRetry={draft.saveDraft} />
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
