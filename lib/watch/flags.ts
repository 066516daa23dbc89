import { Op } from 'sequelize';
import { Publication, PublishedVersion, Study } from '@/models';
import { EvidenceFlag } from '@/models/evidence-flag';
import type { VersionSnapshot } from '@/lib/publishing/types';
import { dryRunWithout } from './dry-run';
import { formatNoticeDate, NOTICE_KINDS, type EvidenceNotice } from './notices';
import type { DryRunDTO, EvidenceFlagDTO } from './types';

/**
 * "Evidence changed": a published verdict whose latest version cites a study that carries a
 * notice. A flag belongs to one version and stands until a later version is published, so the
 * team clears it by re-reviewing and publishing, never by a switch.
 */

export interface FlagCandidate {
  teamId: number;
  publicationId: number;
  reviewId: number;
  slug: string;
  title: string;
  versionNumber: number;
  study: { id: number; citation: string };
  notice: EvidenceNotice;
  reason: string;
  dryRun: DryRunDTO | null;
}

/** The row a candidate becomes (the run creates it; the demo seed inserts it with the query interface). */
export function flagRow(f: FlagCandidate) {
  return {
    teamId: f.teamId,
    publicationId: f.publicationId,
    versionNumber: f.versionNumber,
    studyId: f.study.id,
    kind: f.notice.kind,
    noticeDoi: f.notice.noticeDoi,
    noticeDate: f.notice.date,
    reason: f.reason,
    dryRun: f.dryRun,
  };
}

/** "retracted on 20 Nov 2026" */
export function noticeWhat(n: Pick<EvidenceNotice, 'kind' | 'date'>): string {
  return `${NOTICE_KINDS[n.kind].past}${n.date ? ` on ${formatNoticeDate(n.date)}` : ''}`;
}

export function dryRunSentence(d: DryRunDTO | null): string {
  if (!d) return 'No appraisal of the review uses it now, so the verdict does not depend on it.';
  const p = `${Math.round(d.outcomeProbability * 100)} %`;
  return d.changed
    ? `Without it the verdict would become “${d.verdictLabel}” (now “${d.currentLabel}”; outcome probability ${p}).`
    : `Without it the verdict would stay “${d.currentLabel}” (outcome probability ${p}).`;
}

/** The latest versions of the team's live (not withdrawn) publications, with their snapshots. */
async function livePublications(teamId: number) {
  const pubs = await Publication.findAll({ where: { teamId, withdrawnAt: null } });
  if (!pubs.length) return [];
  const versions = await PublishedVersion.findAll({
    where: { [Op.or]: pubs.map((p) => ({ publicationId: p.id, number: p.latestNumber })) },
  });
  const byPub = new Map(versions.map((v) => [v.publicationId, v.snapshot as unknown as VersionSnapshot]));
  return pubs.filter((p) => byPub.has(p.id)).map((p) => ({ pub: p, snapshot: byPub.get(p.id)! }));
}

/**
 * Every flag the notices call for that does not exist yet, with its reason and dry run.
 * Read-only: the run writes them together with everything else, or not at all.
 */
export async function flagCandidates(
  teamId: number,
  noticeByStudy: Map<number, EvidenceNotice>,
): Promise<FlagCandidate[]> {
  if (!noticeByStudy.size) return [];
  const live = await livePublications(teamId);
  const existing = await EvidenceFlag.findAll({ where: { teamId } });
  const key = (pubId: number, version: number, studyId: number, doi: string) => `${pubId}:${version}:${studyId}:${doi}`;
  const have = new Set(existing.map((f) => key(f.publicationId, f.versionNumber, f.studyId, f.noticeDoi)));
  const out: FlagCandidate[] = [];
  for (const { pub, snapshot } of live) {
    for (const ref of snapshot.references) {
      const notice = noticeByStudy.get(ref.studyId);
      if (!notice || have.has(key(pub.id, pub.latestNumber, ref.studyId, notice.noticeDoi))) continue;
      const dryRun = await dryRunWithout(pub.reviewId, ref.studyId);
      // The reason says what happened; the dry run is kept beside it (engine numbers are not for every reader).
      const reason = `${ref.citation} was ${noticeWhat(notice)} (notice doi:${notice.noticeDoi}).`;
      out.push({
        teamId,
        publicationId: pub.id,
        reviewId: pub.reviewId,
        slug: pub.slug,
        title: snapshot.title,
        versionNumber: pub.latestNumber,
        study: { id: ref.studyId, citation: ref.citation },
        notice,
        reason,
        dryRun,
      });
    }
  }
  return out;
}

/**
 * The flags standing on the team's live publications (the latest version's), newest first.
 * `withDryRun` false leaves the dry run out: it is the engine's verdict of the review as it is
 * now, which a reviewer scoring a new round blind must not see.
 */
export async function standingFlags(teamId: number, withDryRun: boolean): Promise<EvidenceFlagDTO[]> {
  const live = await livePublications(teamId);
  if (!live.length) return [];
  const flags = await EvidenceFlag.findAll({
    where: { [Op.or]: live.map(({ pub }) => ({ publicationId: pub.id, versionNumber: pub.latestNumber })) },
    order: [
      ['createdAt', 'DESC'],
      ['id', 'DESC'],
    ],
  });
  const studies = flags.length
    ? await Study.findAll({ where: { id: { [Op.in]: [...new Set(flags.map((f) => f.studyId))] } } })
    : [];
  const studyById = new Map(studies.map((s) => [s.id, s]));
  const pubById = new Map(live.map((l) => [l.pub.id, l]));
  return flags.map((f) => {
    const { pub, snapshot } = pubById.get(f.publicationId)!;
    const study = studyById.get(f.studyId);
    return {
      id: f.id,
      slug: pub.slug,
      title: snapshot.title,
      versionNumber: f.versionNumber,
      study: { id: f.studyId, citation: study?.citation ?? 'A removed study', doi: study?.doi ?? null },
      notice: { kind: f.kind as EvidenceNotice['kind'], noticeDoi: f.noticeDoi, date: f.noticeDate },
      reason: f.reason,
      dryRun: withDryRun ? f.dryRun : null,
      dryRunText: withDryRun ? dryRunSentence(f.dryRun) : null,
      flaggedAt: f.createdAt.toISOString(),
    };
  });
}

/** The notices the verdict page shows above the verdict: the flags on this publication's given version. */
export async function flagsOfVersion(
  publicationId: number,
  versionNumber: number,
): Promise<{ citation: string; kind: EvidenceNotice['kind']; noticeDoi: string; date: string | null }[]> {
  const flags = await EvidenceFlag.findAll({ where: { publicationId, versionNumber }, order: [['id', 'ASC']] });
  if (!flags.length) return [];
  const studies = await Study.findAll({
    where: { id: { [Op.in]: flags.map((f) => f.studyId) } },
    attributes: ['id', 'citation'],
  });
  const citation = new Map(studies.map((s) => [s.id, s.citation]));
  return flags.map((f) => ({
    citation: citation.get(f.studyId) ?? 'A cited study',
    kind: f.kind as EvidenceNotice['kind'],
    noticeDoi: f.noticeDoi,
    date: f.noticeDate,
  }));
}
