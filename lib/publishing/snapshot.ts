import { Op } from 'sequelize';
import { formatReference } from '@/lib/citations/format';
import { loadReviewData, verdictFromData } from '@/lib/reviews/verdict';
import { toPopulationDTO, toProtocolDTO } from '@/lib/reviews/rows';
import type { MechanismKind, RecommendationsDTO } from '@/lib/reviews/types';
import { bodyReferences } from '@/lib/validation/reviews';
import { Study, Team, User } from '@/models';
import { everydayProtocol, verdictSummary } from './plain';
import { bodyPlainText, renderBodyHtml } from './render-body';
import { robustnessPlain } from './robustness-plain';
import { sanitizeHtml } from './sanitize';
import type { SnapshotMechanism, SnapshotReference, VersionSnapshot } from './types';

/** APA ends with the DOI as a URL; make it a link (the sanitizer keeps only http(s) hrefs). */
function linkUrls(html: string): string {
  return html.replace(/(^|[\s>])(https?:\/\/[^\s<"]+[^\s<".,;)])/g, '$1<a href="$2">$2</a>');
}

/**
 * Everything a verdict page shows, computed once at publish time from the review as it is then:
 * the engine's verdict and mechanism probabilities, the body as sanitized HTML, the references
 * formatted (APA, BibTeX, RIS). Stored as the version's snapshot and never recomputed, so an
 * edit after publishing, a renamed mechanism or a corrected study changes nothing an athlete
 * already read.
 */
export async function buildSnapshot(reviewId: number): Promise<VersionSnapshot | null> {
  const data = await loadReviewData(reviewId);
  if (!data) return null;
  const { review } = data;
  const verdict = verdictFromData(data);
  const byId = new Map(data.mechanisms.map((m) => [m.id, m]));

  const mechanisms: SnapshotMechanism[] = verdict.mechanisms
    .map((m) => ({
      id: m.id,
      name: m.name,
      kind: (byId.get(m.id)?.kind ?? 'physiological') as MechanismKind,
      summary: byId.get(m.id)?.summary ?? '',
      stated: m.stated,
      rank: m.rank,
      probability: m.probability,
      term: m.term,
      share: m.share,
      dosePenalty: m.dosePenalty,
    }))
    .sort((a, b) => a.rank - b.rank);

  // The references: every appraised study and every study the body cites (same team only).
  const cited = bodyReferences(review.body).studyIds;
  const extra = cited.filter((id) => !data.studies.has(id));
  const citedRows = extra.length
    ? await Study.findAll({ where: { id: { [Op.in]: extra }, teamId: review.teamId } })
    : [];
  const studies = [...data.studies.values(), ...citedRows].filter((s) => s.teamId === review.teamId);
  const references: SnapshotReference[] = studies
    .map((s) => {
      const apa = formatReference(s.csl, 'apa');
      return {
        studyId: s.id,
        citation: s.citation,
        apa: apa.text,
        apaHtml: sanitizeHtml(linkUrls(apa.html ?? apa.text)),
        doi: s.doi,
        bibtex: formatReference(s.csl, 'bibtex').text,
        ris: formatReference(s.csl, 'ris').text,
      };
    })
    .sort((a, b) => a.apa.localeCompare(b.apa));
  const citationOf = new Map(references.map((r) => [r.studyId, r.citation]));

  const protocol = toProtocolDTO(review.protocol);
  const population = toPopulationDTO(review);
  const team = await Team.findByPk(review.teamId, { attributes: ['id', 'name', 'slug'] });
  const author = await User.findByPk(review.authorId, { attributes: ['id', 'name'] });
  const recommendations = (review.recommendations ?? {}) as Partial<RecommendationsDTO>;

  return {
    schema: 1,
    title: review.title,
    claim: review.claim,
    claimSource: review.claimSource,
    claimUrl: review.claimUrl,
    tags: review.tags ?? [],
    protocol,
    everyday: everydayProtocol(protocol),
    population,
    verdict: {
      key: verdict.verdict,
      label: verdict.label,
      outcomeProbability: verdict.outcome.probability,
      outcomeTerm: verdict.outcome.term,
      summary: verdictSummary({ key: verdict.verdict, outcomeTerm: verdict.outcome.term, mechanisms, population }),
    },
    mechanisms,
    recommendations: {
      whoMightTry: recommendations.whoMightTry ?? '',
      whoShouldNot: recommendations.whoShouldNot ?? '',
      whatInstead: recommendations.whatInstead ?? '',
    },
    bodyHtml: renderBodyHtml(review.body, {
      mechanismName: (id) => byId.get(id)?.name,
      citation: (id) => citationOf.get(id),
    }),
    bodyText: bodyPlainText(review.body),
    references,
    team: { id: team?.id ?? review.teamId, name: team?.name ?? 'Team', slug: team?.slug ?? '' },
    authors: [author?.name ?? 'Former member'],
    effort: protocol.effort,
    robustness: robustnessPlain(verdict.robustness, verdict.verdict),
  };
}
