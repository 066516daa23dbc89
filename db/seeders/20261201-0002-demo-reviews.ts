import type { Sequelize } from 'sequelize';
import { cleanCsl } from '../../lib/citations/csl';
import { perDomain } from '../../lib/scoring/appraisal-vocabulary';
import { SEEDED_REFERENCES } from '../../lib/citations/demo-records';
import { referenceColumns } from '../../lib/library/columns';
import {
  scoreReviewData,
  type AppraisalRowFacts,
  type MechanismFacts,
  type StudyRowFacts,
} from '../../lib/reviews/verdict';
import { DEMO_REVIEWS, DEMO_STUDIES, type DemoReview, type Inline } from './20261201-0002-demo-reviews-data';
import { DEMO_TEAM } from './demo-accounts';

/**
 * The demo team's evidence library and its three complete claim reviews. Rows are
 * written with the query interface like the 0001 seeder; each review's verdict is computed by
 * the app's own verdict code (lib/reviews/verdict.ts → lib/scoring) from the same rows before
 * it is stored, and a verdict that differs from the story the demo tells is reported.
 */

type Q = ReturnType<Sequelize['getQueryInterface']>;

async function idOf(sequelize: Sequelize, sql: string, replacements: unknown[]): Promise<number> {
  const [[row]] = (await sequelize.query(sql, { replacements })) as [{ id: number }[], unknown];
  if (!row) throw new Error(`Demo seed: no row for ${sql} ${JSON.stringify(replacements)}`);
  return row.id;
}

const text = (value: string) => ({ type: 'text', text: value });

function paragraph(parts: Inline[], studyIds: Map<string, number>) {
  return {
    type: 'paragraph',
    content: parts.map((part) =>
      typeof part === 'string' ? text(part) : { type: 'citation', attrs: { studyId: studyIds.get(part.cite)! } },
    ),
  };
}

/** The review body: the claim, one mechanism block per mechanism, then the evidence, with inline citations. */
function body(review: DemoReview, mechanismIds: number[], studyIds: Map<string, number>) {
  return {
    type: 'doc',
    content: [
      { type: 'heading', attrs: { level: 2 }, content: [text('The claim and its dose')] },
      ...review.intro.map((p) => paragraph(p, studyIds)),
      { type: 'heading', attrs: { level: 2 }, content: [text('Candidate mechanisms')] },
      ...mechanismIds.map((mechanismId) => ({ type: 'mechanismBlock', attrs: { mechanismId } })),
      { type: 'heading', attrs: { level: 2 }, content: [text('What the evidence says')] },
      ...review.evidence.map((p) => paragraph(p, studyIds)),
    ],
  };
}

async function insertStudies(
  sequelize: Sequelize,
  q: Q,
  teamId: number,
  ownerId: number,
  now: Date,
): Promise<Map<string, StudyRowFacts>> {
  const byDoi = new Map<string, StudyRowFacts>();
  for (const reference of SEEDED_REFERENCES) {
    const csl = cleanCsl(reference);
    const columns = referenceColumns(csl);
    const meta = DEMO_STUDIES.find((s) => s.doi === columns.doi);
    if (!meta) throw new Error(`Demo seed: no study facts for ${columns.doi}`);
    await q.bulkInsert('studies', [
      {
        teamId,
        createdById: ownerId,
        csl: JSON.stringify(csl),
        ...columns,
        design: meta.design,
        population: meta.population,
        injured: meta.injured ?? false,
        n: meta.n,
        intensity: meta.intensity,
        durationWeeks: meta.durationWeeks,
        outcome: meta.outcome,
        effect: meta.effect ? JSON.stringify(meta.effect) : null,
        tags: JSON.stringify(meta.tags),
        pdfKey: null,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    const id = await idOf(sequelize, 'SELECT id FROM studies WHERE "teamId" = ? AND doi = ?', [teamId, columns.doi]);
    byDoi.set(meta.doi, {
      id,
      design: meta.design,
      population: meta.population,
      injured: meta.injured ?? false,
      intensity: meta.intensity,
    });
  }
  return byDoi;
}

async function insertReview(
  sequelize: Sequelize,
  q: Q,
  teamId: number,
  review: DemoReview,
  studies: Map<string, StudyRowFacts>,
  now: Date,
  slug: string,
) {
  const authorId = await idOf(sequelize, 'SELECT id FROM users WHERE email = ?', [review.authorEmail]);
  await q.bulkInsert('reviews', [
    {
      teamId,
      authorId,
      title: review.title,
      slug,
      claim: review.claim,
      claimSource: review.claimSource,
      claimUrl: review.claimUrl,
      protocol: JSON.stringify(review.protocol),
      populationStatus: review.population.status,
      populationInjured: review.population.injured,
      outcomeDesirable: review.outcomeDesirable ?? 'higher',
      status: review.status,
      body: JSON.stringify({ type: 'doc', content: [] }),
      recommendations: JSON.stringify(review.recommendations),
      tags: JSON.stringify(review.tags),
      verdict: null,
      version: 1,
      createdAt: now,
      updatedAt: now,
    },
  ]);
  const reviewId = await idOf(sequelize, 'SELECT id FROM reviews WHERE "teamId" = ? AND slug = ?', [teamId, slug]);

  const mechanisms: MechanismFacts[] = [];
  const mechanismIdByKey = new Map<string, number>();
  for (const [position, m] of review.mechanisms.entries()) {
    const row = {
      name: m.name,
      kind: m.kind,
      summary: m.summary,
      minIntensity: m.minIntensity ?? null,
      minEffort: m.minEffort ?? null,
      prior: m.prior,
      magnitude: m.magnitude,
      stated: m.stated ?? false,
      desirable: m.desirable ?? 'higher',
    };
    await q.bulkInsert('mechanisms', [{ reviewId, ...row, position, createdAt: now, updatedAt: now }]);
    const id = await idOf(sequelize, 'SELECT id FROM mechanisms WHERE "reviewId" = ? AND position = ?', [
      reviewId,
      position,
    ]);
    mechanismIdByKey.set(m.key, id);
    mechanisms.push({ id, ...row });
  }

  const appraisals: AppraisalRowFacts[] = [];
  for (const a of review.appraisals) {
    const study = studies.get(a.doi);
    if (!study) throw new Error(`Demo seed: ${a.doi} is not in the demo library`);
    const mechanismId = a.mechanism === null ? null : mechanismIdByKey.get(a.mechanism)!;
    const row = {
      studyId: study.id,
      mechanismId,
      direction: a.direction,
      ...perDomain((d) => a[d] ?? 'none'),
      largeEffect: 0,
      doseResponse: a.doseResponse ?? false,
      confoundingWouldReduce: false,
      applicabilityOverride: a.override?.value ?? null,
    };
    await q.bulkInsert('appraisals', [
      {
        reviewId,
        ...row,
        overrideReason: a.override?.reason ?? null,
        directionReason: a.directionReason ?? null,
        notes: a.notes,
        createdAt: now,
        updatedAt: now,
      },
    ]);
    appraisals.push({ id: appraisals.length + 1, ...row });
  }

  const studyIds = new Map([...studies].map(([doi, s]) => [doi, s.id]));
  const { score } = scoreReviewData({
    review: {
      id: reviewId,
      protocol: review.protocol,
      populationStatus: review.population.status,
      populationInjured: review.population.injured,
    },
    mechanisms,
    appraisals,
    studies: new Map([...studies.values()].map((s) => [s.id, s])),
  });
  if (score.verdict !== review.expectedVerdict) {
    console.warn(
      `Demo seed: "${review.title}" scores "${score.verdict}", not "${review.expectedVerdict}" as the demo story says.`,
    );
  }
  await q.bulkUpdate(
    'reviews',
    {
      body: JSON.stringify(
        body(
          review,
          mechanisms.map((m) => m.id),
          studyIds,
        ),
      ),
      verdict: score.verdict,
    },
    { id: reviewId },
  );
}

export async function up({ context: sequelize }: { context: Sequelize }) {
  const q = sequelize.getQueryInterface();
  const now = new Date();
  const teamId = await idOf(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const ownerId = await idOf(sequelize, 'SELECT id FROM users WHERE email = ?', ['owner@granite-hollow.test']);
  const studies = await insertStudies(sequelize, q, teamId, ownerId, now);
  const slugs = ['light-daily-pinch-block-lifts', 'cold-plunges-after-strength', 'weighted-pull-up-ladder'];
  for (const [i, review] of DEMO_REVIEWS.entries())
    await insertReview(sequelize, q, teamId, review, studies, now, slugs[i]);
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const teamId = await idOf(sequelize, 'SELECT id FROM teams WHERE slug = ?', [DEMO_TEAM.slug]);
  const q = sequelize.getQueryInterface();
  // Mechanisms and appraisals go with their reviews (foreign keys cascade).
  await q.bulkDelete('reviews', { teamId });
  await q.bulkDelete('studies', { teamId });
}
