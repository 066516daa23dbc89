import { conflict } from '@/lib/api/errors';
import type { Actor } from '@/lib/auth/policy';
import { standingFlags } from './flags';
import { latestRun, runningRun, runWatch, startRun, toRunDTO } from './run';
import type { EvidenceFlagDTO, WatchRunDTO } from './types';

/**
 * What the routes call. A member's run rechecks every DOI (the cache only spares the daily job
 * from asking twice a day); it runs in the background and the page polls its progress.
 */

export async function watchStatus(
  teamId: number,
  withDryRun: boolean,
): Promise<{ run: WatchRunDTO | null; flags: EvidenceFlagDTO[] }> {
  const [run, flags] = await Promise.all([latestRun(teamId), standingFlags(teamId, withDryRun)]);
  return { run, flags };
}

export async function startMemberRun(teamId: number, actor: Actor, wait: boolean): Promise<WatchRunDTO> {
  if (await runningRun(teamId))
    throw conflict('The watch is already running for this team; its progress is shown below.');
  const run = await startRun(teamId, 'member', actor.userId);
  const done = runWatch(teamId, { trigger: 'member', startedById: actor.userId, maxAgeMs: 0, runId: run.id });
  if (wait) return done;
  // runWatch records its own failures on the run; nothing is left to catch here.
  void done;
  return toRunDTO(run);
}
