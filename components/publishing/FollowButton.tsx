'use client';

import { useState } from 'react';
import { Button } from '@/components/ui/Button';
import { apiFetch, errorMessage } from '@/lib/swr/fetcher';

/** Follow (or stop following) a team's new verdicts by e-mail: POST / DELETE /api/teams/:teamId/follow. */
export function FollowButton({
  teamId,
  teamName,
  following: initial,
}: {
  teamId: number;
  teamName: string;
  following: boolean;
}) {
  const [following, setFollowing] = useState(initial);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState('');
  async function toggle() {
    setBusy(true);
    setMessage('');
    try {
      const res = await apiFetch<{ following: boolean }>(`/api/teams/${teamId}/follow`, {
        method: following ? 'DELETE' : 'POST',
      });
      setFollowing(res.following);
      setMessage(
        res.following
          ? `You will get an e-mail when ${teamName} publishes a verdict.`
          : `No more e-mails from ${teamName}.`,
      );
    } catch (error) {
      setMessage(errorMessage(error));
    } finally {
      setBusy(false);
    }
  }
  return (
    <div className="space-y-1">
      <Button
        variant={following ? 'secondary' : 'primary'}
        size="sm"
        onClick={toggle}
        disabled={busy}
        aria-pressed={following}
      >
        {following ? `Following ${teamName} ✓` : `Follow ${teamName} by e-mail`}
      </Button>
      {following && <p className="text-ink-muted text-xs">Click again to stop following: no more e-mails.</p>}
      <p aria-live="polite" className="text-ink-muted text-sm">
        {message}
      </p>
    </div>
  );
}
