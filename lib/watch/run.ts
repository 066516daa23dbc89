import { Op } from 'sequelize';
import { env } from '@/lib/env';
import { evidenceChangedMail } from '@/lib/mail/watch-templates';
import { sendMail } from '@/lib/mail/send';
import { writeTransaction } from '@/lib/reviews/transaction';
import { Membership, Review, Study, Team, User } from '@/models';
import { DoiCheck } from '@/models/doi-check';
import { EvidenceFlag } from '@/models/evidence-flag';
import { EvidenceSuggestion } from '@/models/evidence-suggestion';
import { WatchRun } from '@/models/watch-run';
import { lookupWork, type CrossrefClientOptions } from './crossref';
import { dryRunSentence, flagCandidates, flagRow, noticeWhat, type FlagCandidate } from './flags';
import { headlineNotice, type EvidenceNotice } from './notices';
import { suggestionCandidates } from './suggestions';
import type { WatchRunDTO, WatchSummaryDTO } from './types';

/**
 * One run of the evidence watch over a team's library:
 * 1. ask the registry about every DOI not checked within `maxAgeMs` (one at a time, politely —
 *    ./crossref.ts), keeping the answers in memory;
 * 2. if any lookup failed (the registry down, still limiting after its back-offs) the run stops
 *    there, is recorded as failed with the reason, and changes nothing else;
 * 3. otherwise, in one transaction: the answers into the cache with the date checked, each
 *    study's headline notice, an "evidence changed" flag on every live verdict citing a study
 *    with a notice (with the dry run without it), and new-evidence suggestions;
 * 4. after the commit: the flagged verdicts' cached pages are dropped (the same call publishing
 *    uses), and their authors and the team's owners are mailed.
 */

/** A DOI checked more recently than this is not asked again by the daily run (common practice: a day, less a margin for the job's own drift). */
export const DAILY_MAX_AGE_MS = 20 * 60 * 60 * 1000;
/** A "running" run older than this is taken to have died with its process (2,000 DOIs take about a minute). */
const STALE_RUN_MS = 30 * 60 * 1000;
/** How often (in lookups) the run writes its progress for the button's progress bar. */
const PROGRESS_EVERY = 10;

export interface WatchOptions {
  trigger: 'schedule' | 'member';
  startedById?: number | null;
  /** Recheck DOIs last checked longer ago than this (0: recheck all). */
  maxAgeMs?: number;
  client?: CrossrefClientOptions;
  /** A run row created beforehand (the route answers with it at once). */
  runId?: number;
}

export function toRunDTO(run: WatchRun): WatchRunDTO {
  return {
    id: run.id,
    teamId: run.teamId,
    trigger: run.trigger,
    status: run.status as WatchRunDTO['status'],
    total: run.total,
    checked: run.checked,
    error: run.error,
    summary: run.summary,
    startedAt: run.createdAt.toISOString(),
    finishedAt: run.finishedAt ? run.finishedAt.toISOString() : null,
  };
}

export async function startRun(teamId: number, trigger: WatchOptions['trigger'], startedById: number | null) {
  return WatchRun.create({
    teamId,
    trigger,
    startedById,
    status: 'running',
    error: null,
    summary: null,
    finishedAt: null,
  });
}

const emptySummary = (): WatchSummaryDTO => ({
  asked: 0,
  cached: 0,
  notFound: 0,
  newNotices: [],
  flagged: [],
  mailed: 0,
  suggestions: 0,
  backoffs: 0,
});

const sameNotice = (a: EvidenceNotice | null, b: EvidenceNotice | null) =>
  (a?.kind ?? null) === (b?.kind ?? null) &&
  (a?.noticeDoi ?? null) === (b?.noticeDoi ?? null) &&
  (a?.date ?? null) === (b?.date ?? null);

export async function runWatch(teamId: number, options: WatchOptions): Promise<WatchRunDTO> {
  const run = options.runId
    ? (await WatchRun.findByPk(options.runId))!
    : await startRun(teamId, options.trigger, options.startedById ?? null);
  const summary = emptySummary();
  try {
    const studies = await Study.findAll({ where: { teamId, doi: { [Op.ne]: null } }, order: [['id', 'ASC']] });
    const dois = [...new Set(studies.map((s) => s.doi!.toLowerCase()))];
    const maxAge = options.maxAgeMs ?? DAILY_MAX_AGE_MS;
    const cached = dois.length ? await DoiCheck.findAll({ where: { doi: { [Op.in]: dois } } }) : [];
    const cacheByDoi = new Map(cached.map((c) => [c.doi, c]));
    const now = Date.now();
    const toAsk = dois.filter((d) => {
      const c = cacheByDoi.get(d);
      return !c || now - c.checkedAt.getTime() >= maxAge;
    });
    summary.cached = dois.length - toAsk.length;
    await run.update({ total: toAsk.length, checked: 0 });

    // 1–2. Ask, one at a time; the first failure ends the run with nothing changed.
    const answers = new Map<string, { found: boolean; notices: EvidenceNotice[] }>();
    for (const [i, doi] of toAsk.entries()) {
      const result = await lookupWork(doi, {
        ...options.client,
        onBackoff: (ms) => {
          summary.backoffs += 1;
          options.client?.onBackoff?.(ms);
        },
      });
      if (!result.ok) {
        summary.asked = i + 1;
        await run.update({ status: 'failed', error: result.reason, checked: i, summary, finishedAt: new Date() });
        return toRunDTO(run);
      }
      answers.set(doi, result.found ? { found: true, notices: result.notices } : { found: false, notices: [] });
      if (!result.found) summary.notFound += 1;
      if ((i + 1) % PROGRESS_EVERY === 0) await run.update({ checked: i + 1 });
    }
    summary.asked = toAsk.length;

    // 3. What changes: each study's headline notice, from fresh answers or the cache.
    const noticesOf = (doi: string) => answers.get(doi)?.notices ?? cacheByDoi.get(doi)?.notices ?? [];
    const noticeByStudy = new Map<number, EvidenceNotice>();
    const studyUpdates: { study: Study; notice: EvidenceNotice | null }[] = [];
    for (const study of studies) {
      const notice = headlineNotice(noticesOf(study.doi!.toLowerCase()));
      if (notice) noticeByStudy.set(study.id, notice);
      if (!sameNotice(study.evidenceNotice ?? null, notice)) {
        studyUpdates.push({ study, notice });
        if (notice) summary.newNotices.push({ studyId: study.id, citation: study.citation, notice });
      }
    }
    const flags = await flagCandidates(teamId, noticeByStudy);
    const suggestions = await suggestionCandidates(teamId);

    const checkedAt = new Date();
    await writeTransaction(async (transaction) => {
      for (const [doi, answer] of answers) {
        const existing = cacheByDoi.get(doi);
        if (existing) await existing.update({ ...answer, checkedAt }, { transaction });
        else await DoiCheck.create({ doi, ...answer, checkedAt }, { transaction });
      }
      for (const { study, notice } of studyUpdates) await study.update({ evidenceNotice: notice }, { transaction });
      for (const f of flags) await EvidenceFlag.create(flagRow(f), { transaction });
      if (suggestions.length)
        await EvidenceSuggestion.bulkCreate(
          suggestions.map((s) => ({ ...s, dismissedAt: null, dismissedById: null })),
          { transaction },
        );
    });
    summary.flagged = flags.map((f) => ({ slug: f.slug, title: f.title, studyId: f.study.id }));
    summary.suggestions = suggestions.length;

    // 4. After the commit, the mails (a refused mail does not undo the flag). The public page reads
    // the flags on every render and proxies keep it for a second at most (docs/deployment.md).
    summary.mailed = await mailFlags(teamId, flags);

    await run.update({ status: 'done', checked: toAsk.length, summary, finishedAt: new Date() });
    return toRunDTO(run);
  } catch (error) {
    console.error('Evidence watch failed', error);
    await run.update({
      status: 'failed',
      error: 'The watch stopped on an unexpected error; nothing was changed. It runs again tomorrow.',
      summary,
      finishedAt: new Date(),
    });
    return toRunDTO(run);
  }
}

/** One mail per flag to the review's author and each owner of the team; returns how many went out. */
async function mailFlags(teamId: number, flags: FlagCandidate[]): Promise<number> {
  if (!flags.length) return 0;
  const team = await Team.findByPk(teamId, { attributes: ['name'] });
  const owners = await Membership.findAll({ where: { teamId, role: 'owner' }, attributes: ['userId'] });
  const reviews = await Review.findAll({
    where: { id: { [Op.in]: flags.map((f) => f.reviewId) } },
    attributes: ['id', 'authorId'],
  });
  const authorOf = new Map(reviews.map((r) => [r.id, r.authorId]));
  const userIds = [...new Set([...owners.map((o) => o.userId), ...reviews.map((r) => r.authorId)])];
  const users = await User.findAll({ where: { id: { [Op.in]: userIds } }, attributes: ['id', 'email'] });
  const email = new Map(users.map((u) => [u.id, u.email]));
  const base = env().APP_URL;
  let sent = 0;
  for (const f of flags) {
    const to = new Set([authorOf.get(f.reviewId), ...owners.map((o) => o.userId)].filter((id): id is number => !!id));
    for (const userId of to) {
      const address = email.get(userId);
      if (!address) continue;
      try {
        await sendMail(
          evidenceChangedMail({
            to: address,
            teamName: team?.name ?? 'your team',
            title: f.title,
            citation: f.study.citation,
            what: noticeWhat(f.notice),
            noticeDoi: f.notice.noticeDoi,
            dryRun: dryRunSentence(f.dryRun),
            verdictUrl: `${base}/v/${f.slug}`,
            reviewUrl: `${base}/reviews/${f.reviewId}`,
          }),
        );
        sent += 1;
      } catch (error) {
        console.error(`Evidence watch: the mail relay refused the mail to user ${userId}`, error);
      }
    }
  }
  return sent;
}

/** The latest run of the team, or null before the first. */
export async function latestRun(teamId: number): Promise<WatchRunDTO | null> {
  const run = await WatchRun.findOne({ where: { teamId }, order: [['id', 'DESC']] });
  return run ? toRunDTO(run) : null;
}

/** A run already going for the team (the button does not start a second). */
export async function runningRun(teamId: number): Promise<WatchRun | null> {
  // A run the process never finished (a restart mid-run) stops blocking after this long.
  const since = new Date(Date.now() - STALE_RUN_MS);
  return WatchRun.findOne({
    where: { teamId, status: 'running', createdAt: { [Op.gt]: since } },
    order: [['id', 'DESC']],
  });
}
