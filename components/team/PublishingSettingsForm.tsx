'use client';

import { useActionState } from 'react';
import { updateSettingsAction } from '@/app/(app)/team/actions';
import { FormMessage } from '@/components/ui/FormMessage';
import { SubmitButton } from '@/components/ui/SubmitButton';

/** The owner's two publishing rules: peer review before publishing, and whether coaches may publish. */
export function PublishingSettingsForm({
  teamId,
  settings,
}: {
  teamId: number;
  settings: { requirePeerReview: boolean; coachesMayPublish: boolean };
}) {
  const [state, action] = useActionState(updateSettingsAction, {});
  return (
    <section
      aria-labelledby="publishing-rules-heading"
      className="border-line bg-paper mt-10 space-y-4 rounded-lg border p-5"
    >
      <h2 id="publishing-rules-heading" className="text-xl font-semibold">
        Publishing rules
      </h2>
      <FormMessage state={state} />
      <form action={action} className="space-y-3">
        <input type="hidden" name="teamId" value={teamId} />
        <label className="flex items-start gap-3">
          <input
            type="checkbox"
            name="requirePeerReview"
            defaultChecked={settings.requirePeerReview}
            className="accent-granite-700 mt-1 size-4 shrink-0"
          />
          <span>
            <span className="font-medium">Require a peer-review round before publishing</span>
            <span className="text-chalk-600 block text-sm">
              Only a review approved by a closed round can be published for athletes.
            </span>
          </span>
        </label>
        <label className="flex items-start gap-3">
          <input
            type="checkbox"
            name="coachesMayPublish"
            defaultChecked={settings.coachesMayPublish}
            className="accent-granite-700 mt-1 size-4 shrink-0"
          />
          <span>
            <span className="font-medium">Let coaches publish</span>
            <span className="text-chalk-600 block text-sm">Otherwise only the owner publishes verdicts.</span>
          </span>
        </label>
        <SubmitButton>Save publishing rules</SubmitButton>
      </form>
    </section>
  );
}
