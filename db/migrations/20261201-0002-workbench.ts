import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The review workbench: claim reviews with their structured protocol and Tiptap body,
 * the candidate mechanisms, the team's evidence library of studies, and the appraisals that
 * link a study to a mechanism (or to the claimed outcome itself).
 *
 * JSON columns hold what is read and written as a whole and never queried by part (protocol,
 * body, recommendations, CSL-JSON, effect data). Tags are JSON too: a team has a handful of
 * reviews per week, so filtering tags in memory after the team filter costs nothing.
 */

const timestamps = {
  createdAt: { type: DataTypes.DATE, allowNull: false },
  updatedAt: { type: DataTypes.DATE, allowNull: false },
};
const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const concern = { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'none' };

export async function up({ context: q }: { context: QueryInterface }) {
  await q.createTable('reviews', {
    id,
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    // A person who leaves keeps their reviews with the team; deleting the account itself is refused
    // while they author reviews (no silent loss of a team's work).
    authorId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    title: { type: DataTypes.STRING(200), allowNull: false },
    slug: { type: DataTypes.STRING(80), allowNull: false },
    claim: { type: DataTypes.STRING(500), allowNull: false },
    claimSource: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
    claimUrl: { type: DataTypes.STRING(2000), allowNull: true },
    protocol: { type: DataTypes.JSON, allowNull: false },
    populationStatus: { type: DataTypes.STRING(16), allowNull: true },
    populationInjured: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'draft' },
    body: { type: DataTypes.JSON, allowNull: false },
    recommendations: { type: DataTypes.JSON, allowNull: false },
    tags: { type: DataTypes.JSON, allowNull: false },
    // The verdict key as of the last change to the review, its mechanisms, appraisals or cited
    // studies: a cache for the dashboard's list and filter, recomputed by lib/reviews on every write.
    verdict: { type: DataTypes.STRING(16), allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    ...timestamps,
  });
  await q.addIndex('reviews', ['teamId', 'slug'], { unique: true, name: 'reviews_team_slug' });
  await q.addIndex('reviews', ['teamId', 'updatedAt'], { name: 'reviews_team_updated' });

  await q.createTable('mechanisms', {
    id,
    reviewId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    name: { type: DataTypes.STRING(160), allowNull: false },
    kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'physiological' },
    summary: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    minIntensity: { type: DataTypes.FLOAT, allowNull: true },
    minEffort: { type: DataTypes.STRING(16), allowNull: true },
    prior: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0.5 },
    magnitude: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'moderate' },
    stated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  await q.addIndex('mechanisms', ['reviewId', 'position'], { name: 'mechanisms_review_position' });

  await q.createTable('studies', {
    id,
    teamId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'teams', key: 'id' },
      onDelete: 'CASCADE',
    },
    createdById: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'users', key: 'id' },
      onDelete: 'SET NULL',
    },
    csl: { type: DataTypes.JSON, allowNull: false },
    // ASCII letters lower-cased (DOI names are case-insensitive under ASCII case folding: DOI
    // Handbook, ch. 2 "Numbering"), so the unique index sees "10.5555/ABC" and "10.5555/abc" as
    // the same work. NULLs never collide in a SQLite unique index.
    doi: { type: DataTypes.STRING(300), allowNull: true },
    title: { type: DataTypes.STRING(1000), allowNull: false },
    // Normalized title + year, to recognise an entry without a DOI that is already in the library.
    fingerprint: { type: DataTypes.STRING(300), allowNull: false },
    year: { type: DataTypes.INTEGER, allowNull: true },
    journal: { type: DataTypes.STRING(500), allowNull: true },
    citation: { type: DataTypes.STRING(300), allowNull: false },
    design: { type: DataTypes.STRING(24), allowNull: true },
    population: { type: DataTypes.STRING(16), allowNull: true },
    injured: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    n: { type: DataTypes.INTEGER, allowNull: true },
    intensity: { type: DataTypes.FLOAT, allowNull: true },
    durationWeeks: { type: DataTypes.FLOAT, allowNull: true },
    outcome: { type: DataTypes.STRING(500), allowNull: true },
    effect: { type: DataTypes.JSON, allowNull: true },
    tags: { type: DataTypes.JSON, allowNull: false },
    pdfKey: { type: DataTypes.STRING(300), allowNull: true },
    ...timestamps,
  });
  await q.addIndex('studies', ['teamId', 'doi'], { unique: true, name: 'studies_team_doi' });
  await q.addIndex('studies', ['teamId', 'fingerprint'], { name: 'studies_team_fingerprint' });
  await q.addIndex('studies', ['teamId', 'createdAt'], { name: 'studies_team_created' });

  await q.createTable('appraisals', {
    id,
    reviewId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'reviews', key: 'id' },
      onDelete: 'CASCADE',
    },
    // lib/library refuses to delete a study that appraisals use unless asked to force it, and
    // then deletes them on purpose; the cascade only keeps the database consistent.
    studyId: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'studies', key: 'id' },
      onDelete: 'CASCADE',
    },
    // NULL: the appraisal tests the claimed outcome itself.
    mechanismId: {
      type: DataTypes.INTEGER,
      allowNull: true,
      references: { model: 'mechanisms', key: 'id' },
      onDelete: 'CASCADE',
    },
    direction: { type: DataTypes.STRING(16), allowNull: false },
    riskOfBias: concern,
    inconsistency: concern,
    indirectness: concern,
    imprecision: concern,
    publicationBias: concern,
    largeEffect: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    doseResponse: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    confoundingWouldReduce: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    applicabilityOverride: { type: DataTypes.FLOAT, allowNull: true },
    overrideReason: { type: DataTypes.TEXT, allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    ...timestamps,
  });
  await q.addIndex('appraisals', ['reviewId'], { name: 'appraisals_review' });
  await q.addIndex('appraisals', ['studyId'], { name: 'appraisals_study' });
  await q.addIndex('appraisals', ['mechanismId'], { name: 'appraisals_mechanism' });
}

export async function down({ context: q }: { context: QueryInterface }) {
  for (const table of ['appraisals', 'studies', 'mechanisms', 'reviews']) await q.dropTable(table);
}
