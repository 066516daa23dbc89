import { Op, literal, type Transaction, type WhereOptions } from 'sequelize';
import { conflict, notFound } from '@/lib/api/errors';
import { recordEvent } from '@/lib/audit/record';
import { decide, type Actor } from '@/lib/auth/policy';
import { applyReferenceFields, type CslItem } from '@/lib/citations/csl';
import { uniqueOrConflict, writeTransaction } from '@/lib/reviews/transaction';
import { deriveAll, loadReviewData, refreshVerdict, refreshVerdictsOfStudy } from '@/lib/reviews/verdict';
import { toAppraisalDTO } from '@/lib/reviews/rows';
import type { ImportResultDTO, StudyDetailDTO, StudyDTO, StudyInUseDTO, StudyListDTO } from '@/lib/reviews/types';
import type { ReferenceInput, StudyListQuery, StudyMetaInput, UpdateStudyInput } from '@/lib/validation/studies';
import { Appraisal, Review, Study } from '@/models';
import { referenceColumns } from './columns';
import { storage } from '@/lib/storage';
import { blindReviewIds } from '@/lib/rounds/freeze';
import { toStudyDTO } from './dto';
import { studyHasTag, studyTextMatches } from './study-filters';

/** Appraisals per study, for the given studies. */
export async function appraisalCounts(studyIds: number[], transaction?: Transaction): Promise<Map<number, number>> {
  if (!studyIds.length) return new Map();
  const rows = (await Appraisal.findAll({
    where: { studyId: { [Op.in]: [...new Set(studyIds)] } },
    attributes: ['studyId', [literal('COUNT(*)'), 'count']],
    group: ['studyId'],
    raw: true,
    transaction,
  })) as unknown as { studyId: number; count: number }[];
  return new Map(rows.map((r) => [r.studyId, Number(r.count)]));
}

export async function studiesDTO(studies: Study[]): Promise<StudyDTO[]> {
  const counts = await appraisalCounts(studies.map((s) => s.id));
  return studies.map((s) => toStudyDTO(s, counts.get(s.id)));
}

/** The study, or a 404; the route then asks the policy about its team. */
export async function studyById(studyId: number): Promise<Study> {
  const study = await Study.findByPk(studyId);
  if (!study) throw notFound('That study');
  return study;
}

const SORT_COLUMNS = {
  added: [['createdAt'], ['id']],
  title: [['title'], ['id']],
  year: [['year'], ['title']],
  citation: [['citation'], ['year']],
  design: [['design'], ['title']],
} as const;

/** GET /api/studies: the libraries of the teams where the caller may read studies (the policy decides per team). */
export async function listStudies(actor: Actor, query: StudyListQuery): Promise<StudyListDTO> {
  const teamIds =
    query.teamId !== undefined
      ? [query.teamId]
      : [...actor.roles.keys()].filter((teamId) => decide(actor, 'study.read', { teamId }) === 'allow');
  const page = { page: query.page, pageSize: query.pageSize };
  if (!teamIds.length) return { studies: [], total: 0, ...page };
  const and: WhereOptions[] = [{ teamId: { [Op.in]: teamIds } }];
  if (query.design) and.push({ design: query.design });
  if (query.q) and.push(studyTextMatches(query.q));
  if (query.tag) and.push(studyHasTag(query.tag));
  const descending = query.sort.startsWith('-');
  const key = query.sort.replace(/^-/, '') as keyof typeof SORT_COLUMNS;
  const order = SORT_COLUMNS[key].map(([column]) => [column, descending ? 'DESC' : 'ASC'] as [string, string]);
  const { rows, count } = await Study.findAndCountAll({
    where: { [Op.and]: and },
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { studies: await studiesDTO(rows), total: count, ...page };
}

/**
 * GET /api/studies/:id and the study page: the study and its appraisals across the team's
 * reviews, as `viewerId` may see them. Blind scoring: a review this person scores blind in an
 * open round is left out, since its rows carry the engine's certainty and applicability.
 */
export async function studyDetail(study: Study, viewerId: number): Promise<StudyDetailDTO> {
  const blind = await blindReviewIds(viewerId);
  const appraisals = await Appraisal.findAll({
    where: { studyId: study.id },
    order: [
      ['reviewId', 'ASC'],
      ['id', 'ASC'],
    ],
  });
  const reviewIds = [...new Set(appraisals.map((a) => a.reviewId))].filter((id) => !blind.has(id));
  const rows: StudyDetailDTO['appraisals'] = [];
  for (const reviewId of reviewIds) {
    // Certainty and applicability depend on the review's protocol and population, so each review is derived on its own.
    const data = await loadReviewData(reviewId);
    if (!data) continue;
    const derived = deriveAll(data);
    const names = new Map(data.mechanisms.map((m) => [m.id, m.name]));
    for (const a of data.appraisals.filter((x) => x.studyId === study.id)) {
      rows.push({
        ...toAppraisalDTO(a, derived.get(a.id)!),
        reviewTitle: data.review.title,
        mechanismName: a.mechanismId === null ? null : (names.get(a.mechanismId) ?? null),
      });
    }
  }
  return { study: toStudyDTO(study, appraisals.length), appraisals: rows };
}

/** Columns of the appraisal-facing fields, from validated input. */
function metaColumns(meta: StudyMetaInput) {
  const out: Partial<
    Pick<
      Study,
      'design' | 'population' | 'injured' | 'n' | 'intensity' | 'durationWeeks' | 'outcome' | 'effect' | 'tags'
    >
  > = {};
  if (meta.design !== undefined) out.design = meta.design;
  if (meta.population !== undefined) out.population = meta.population;
  if (meta.injured !== undefined) out.injured = meta.injured;
  if (meta.n !== undefined) out.n = meta.n;
  if (meta.intensity !== undefined) out.intensity = meta.intensity;
  if (meta.durationWeeks !== undefined) out.durationWeeks = meta.durationWeeks;
  if (meta.outcome !== undefined) out.outcome = meta.outcome || null;
  if (meta.effect !== undefined) out.effect = meta.effect as Record<string, unknown> | null;
  if (meta.tags !== undefined) out.tags = meta.tags;
  return out;
}

/** A study that is already in the team's library: same DOI, or (without a DOI) same title and year. */
export async function findDuplicate(
  teamId: number,
  columns: { doi: string | null; fingerprint: string },
  transaction?: Transaction,
  exceptId?: number,
): Promise<Study | null> {
  const where: WhereOptions = columns.doi ? { teamId, doi: columns.doi } : { teamId, fingerprint: columns.fingerprint };
  const found = await Study.findOne({ where, transaction });
  return found && found.id !== exceptId ? found : null;
}

/** Builds the row for a new study (not saved). */
export function newStudyRow(
  teamId: number,
  userId: number | null,
  csl: CslItem,
  meta: StudyMetaInput,
  columns = referenceColumns(csl),
) {
  return {
    teamId,
    createdById: userId,
    csl,
    ...columns,
    design: null,
    population: null,
    injured: false,
    n: null,
    intensity: null,
    durationWeeks: null,
    outcome: null,
    effect: null,
    tags: [] as string[],
    pdfKey: null,
    ...metaColumns(meta),
  };
}

/** POST /api/studies with the reference typed by hand. */
export async function createStudyByHand(
  teamId: number,
  userId: number,
  input: ReferenceInput & StudyMetaInput,
): Promise<{ results: ImportResultDTO[]; studies: StudyDTO[] }> {
  const csl = applyReferenceFields({ type: 'article-journal' }, input);
  const columns = referenceColumns(csl);
  const existing = await findDuplicate(teamId, columns);
  if (existing) {
    return {
      results: [
        {
          index: 0,
          title: columns.title,
          status: 'duplicate',
          studyId: existing.id,
          reason: `Already in the library as ${existing.citation}.`,
        },
      ],
      studies: await studiesDTO([existing]),
    };
  }
  const study = await uniqueOrConflict(
    `A study with DOI ${columns.doi} was added at the same moment; it is in the library now.`,
    () =>
      writeTransaction(async (transaction) => {
        const created = await Study.create(newStudyRow(teamId, userId, csl, input), { transaction });
        await recordEvent(
          { teamId, actorId: userId, action: 'study.created', subjectType: 'study', subjectId: created.id },
          transaction,
        );
        return created;
      }),
  );
  return {
    results: [{ index: 0, title: study.title, status: 'added', studyId: study.id }],
    studies: [toStudyDTO(study)],
  };
}

/** PATCH /api/studies/:id: reference fields rebuild the CSL; appraisal fields change every review that uses the study. */
export async function updateStudy(study: Study, userId: number, input: UpdateStudyInput): Promise<StudyDTO> {
  const referenceKeys = ['title', 'authors', 'year', 'journal', 'volume', 'issue', 'pages', 'doi', 'url'] as const;
  const touchesReference = referenceKeys.some((k) => input[k] !== undefined);
  const csl = touchesReference ? applyReferenceFields(study.csl, input) : study.csl;
  const columns = referenceColumns(csl);
  return uniqueOrConflict(`Another study in the library has DOI ${columns.doi}.`, () =>
    writeTransaction(async (transaction) => {
      const count = (await appraisalCounts([study.id], transaction)).get(study.id) ?? 0;
      if (input.design === null && count > 0) {
        throw conflict(
          `${count} appraisal${count === 1 ? '' : 's'} grade their certainty from this study's design; it cannot be cleared while they exist.`,
        );
      }
      if (touchesReference && columns.doi && columns.doi !== study.doi) {
        const other = await findDuplicate(
          study.teamId,
          { doi: columns.doi, fingerprint: columns.fingerprint },
          transaction,
          study.id,
        );
        if (other) throw conflict(`Another study in the library (${other.citation}) has DOI ${columns.doi}.`);
      }
      await study.update({ ...(touchesReference ? { csl, ...columns } : {}), ...metaColumns(input) }, { transaction });
      await recordEvent(
        { teamId: study.teamId, actorId: userId, action: 'study.updated', subjectType: 'study', subjectId: study.id },
        transaction,
      );
      await refreshVerdictsOfStudy(study.id, transaction);
      return toStudyDTO(study, count);
    }),
  );
}

/**
 * DELETE /api/studies/:id. A study that appraisals use is not deleted silently: without
 * `force` the answer is 409 with how many appraisals in which reviews use it; with `force` the
 * appraisals go too (and those reviews' verdicts are recomputed).
 */
export async function deleteStudy(
  study: Study,
  userId: number,
  force: boolean,
): Promise<{ ok: true; study: StudyDTO; deletedAppraisals: number } | { ok: false; body: StudyInUseDTO }> {
  const dto = toStudyDTO(study, 0);
  // Counted inside the transaction, so an appraisal added meanwhile is never deleted unasked.
  const outcome = await writeTransaction(async (transaction) => {
    const appraisals = await Appraisal.findAll({
      where: { studyId: study.id },
      attributes: ['id', 'reviewId'],
      transaction,
    });
    const reviewIds = [...new Set(appraisals.map((a) => a.reviewId))];
    if (appraisals.length && !force) {
      const reviews = await Review.findAll({
        where: { id: { [Op.in]: reviewIds } },
        attributes: ['id', 'title'],
        order: [['id', 'ASC']],
        transaction,
      });
      const n = appraisals.length;
      return {
        ok: false as const,
        body: {
          error: `${n} appraisal${n === 1 ? '' : 's'} in ${reviews.length} review${reviews.length === 1 ? '' : 's'} use${n === 1 ? 's' : ''} this study. Delete ${n === 1 ? 'it' : 'them'} first, or confirm to delete the study with ${n === 1 ? 'its appraisal' : 'its appraisals'}.`,
          appraisalCount: n,
          reviews: reviews.map((r) => ({ id: r.id, title: r.title })),
        },
      };
    }
    await Appraisal.destroy({ where: { studyId: study.id }, transaction });
    await study.destroy({ transaction });
    for (const reviewId of reviewIds) await refreshVerdict(reviewId, { transaction, touch: true });
    await recordEvent(
      {
        teamId: study.teamId,
        actorId: userId,
        action: 'study.deleted',
        subjectType: 'study',
        subjectId: study.id,
        data: { title: study.title, deletedAppraisals: appraisals.length },
      },
      transaction,
    );
    return { ok: true as const, deletedAppraisals: appraisals.length };
  });
  if (!outcome.ok) return outcome;
  // The file goes after the row, so a failed delete never leaves a row pointing at a missing file.
  if (study.pdfKey) await storage().delete(study.pdfKey);
  return { ok: true, study: { ...dto, hasPdf: false }, deletedAppraisals: outcome.deletedAppraisals };
}

/** The appraisal-facing fields of a create body, to apply to every study it yields. */
export function studyMetaOf(body: StudyMetaInput): StudyMetaInput {
  const keys = [
    'design',
    'population',
    'injured',
    'n',
    'intensity',
    'durationWeeks',
    'outcome',
    'effect',
    'tags',
  ] as const;
  const meta: Record<string, unknown> = {};
  for (const key of keys) if (body[key] !== undefined) meta[key] = body[key];
  return meta as StudyMetaInput;
}
