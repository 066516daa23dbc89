import { likelihoodBand } from '@/lib/scoring/likelihood';
import {
  cohenKappa,
  interpretAlpha,
  interpretKappa,
  krippendorffAlpha,
  spreadFlags,
  type RatingMatrix,
} from '@/lib/stats/agreement';
import type { AgreementDTO, Contribution, MechanismAgreementDTO, ResolutionDTO } from './types';

/**
 * Assembles a round's agreement from plain rows: the statistics come from lib/stats (never
 * reimplemented here), the engine's band from lib/scoring. Pure, so it is tested without a
 * database.
 */

/** The whole 0…6 rating scale: weighted kappa spaces its weights over it (docs/scoring.md §7). */
export const BAND_CATEGORIES = [0, 1, 2, 3, 4, 5, 6] as const;

export interface AgreementInput {
  mechanisms: { id: number; name: string; position: number; engineProbability: number }[];
  /** Submitted scorecards only, in a stable order (rows of the matrix). */
  scorecards: {
    reviewerId: number;
    reviewerName: string;
    ratings: { mechanismId: number; band: number | null; contribution: Contribution | null; comment: string }[];
  }[];
  resolutions: ResolutionDTO[];
}

/** Rows reviewers, columns mechanisms in the review's order, null where a band is missing. */
export function ratingMatrix(input: AgreementInput): (number | null)[][] {
  return input.scorecards.map((card) => {
    const byMechanism = new Map(card.ratings.map((r) => [r.mechanismId, r.band]));
    return input.mechanisms.map((m) => byMechanism.get(m.id) ?? null);
  });
}

function alphaOrNull(matrix: RatingMatrix, metric: 'ordinal' | 'nominal' | 'interval'): number | null {
  try {
    return krippendorffAlpha(matrix, { metric });
  } catch {
    // lib/stats throws when no mechanism has two ratings: there is nothing to agree on yet.
    return null;
  }
}

/**
 * Fewest mechanisms rated by two reviewers or more before α or κ gets a strength word: with one
 * or two items a single disagreement swings the coefficient across every band of its reading
 * (common practice; Krippendorff 2004, ch. 11, asks for enough units to sample the scale).
 */
export const MIN_AGREEMENT_ITEMS = 3;

export type AgreementFigures = Pick<
  AgreementDTO,
  'raters' | 'alpha' | 'kappa' | 'mechanisms' | 'flaggedCount' | 'unresolvedFlags'
>;

export function assembleAgreement(input: AgreementInput): AgreementFigures {
  const mechanisms = [...input.mechanisms].sort((a, b) => a.position - b.position || a.id - b.id);
  const ordered = { ...input, mechanisms };
  const matrix = ratingMatrix(ordered);
  const raters = matrix.length;

  let alpha: AgreementDTO['alpha'] = {
    ordinal: null,
    nominal: null,
    interval: null,
    interpretation: null,
    missing: raters < 2 ? 'Agreement needs at least two submitted scorecards.' : null,
  };
  if (raters >= 2 && mechanisms.length > 0) {
    const ordinal = alphaOrNull(matrix, 'ordinal');
    alpha = {
      ordinal,
      nominal: alphaOrNull(matrix, 'nominal'),
      interval: alphaOrNull(matrix, 'interval'),
      interpretation: ordinal === null ? null : interpretAlpha(ordinal),
      missing: ordinal === null ? 'No mechanism has two ratings yet.' : null,
    };
    const items = mechanisms.filter((_, column) => matrix.filter((row) => row[column] !== null).length >= 2).length;
    if (ordinal !== null && items < MIN_AGREEMENT_ITEMS) {
      alpha = {
        ...alpha,
        interpretation: null,
        missing: `A reading of agreement needs at least ${MIN_AGREEMENT_ITEMS} mechanisms rated by two reviewers or more; ${items} so far.`,
      };
    }
  }

  let kappa: AgreementDTO['kappa'] = null;
  if (raters === 2 && alpha.missing === null) {
    try {
      const linear = cohenKappa(matrix[0], matrix[1], { weights: 'linear', categories: [...BAND_CATEGORIES] });
      const quadratic = cohenKappa(matrix[0], matrix[1], { weights: 'quadratic', categories: [...BAND_CATEGORIES] });
      kappa = { linear, quadratic, interpretation: interpretKappa(linear) };
    } catch {
      kappa = null;
    }
  }

  const flagged = new Set(raters > 0 && mechanisms.length > 0 ? spreadFlags(matrix).map((u) => mechanisms[u].id) : []);
  const resolutionOf = new Map(input.resolutions.map((r) => [r.mechanismId, r]));

  const rows: MechanismAgreementDTO[] = mechanisms.map((m, column) => {
    const ratings = ordered.scorecards.flatMap((card, row) => {
      const band = matrix[row][column];
      if (band === null) return [];
      const rating = card.ratings.find((r) => r.mechanismId === m.id)!;
      return [
        {
          reviewerId: card.reviewerId,
          reviewerName: card.reviewerName,
          band,
          contribution: rating.contribution,
          comment: rating.comment,
        },
      ];
    });
    const bands = ratings.map((r) => r.band);
    const min = bands.length ? Math.min(...bands) : null;
    const max = bands.length ? Math.max(...bands) : null;
    return {
      mechanismId: m.id,
      name: m.name,
      position: m.position,
      ratings,
      min,
      max,
      span: min === null || max === null ? null : max - min,
      flagged: flagged.has(m.id),
      engineBand: likelihoodBand(m.engineProbability),
      engineProbability: m.engineProbability,
      resolution: resolutionOf.get(m.id) ?? null,
    };
  });
  // Where the reviewers disagree comes first: that is what the author has to settle.
  rows.sort(
    (a, b) =>
      Number(b.flagged) - Number(a.flagged) ||
      (b.span ?? -1) - (a.span ?? -1) ||
      a.position - b.position ||
      a.mechanismId - b.mechanismId,
  );
  const flaggedCount = rows.filter((r) => r.flagged).length;
  const unresolvedFlags = rows.filter((r) => r.flagged && !r.resolution).length;
  return { raters, alpha, kappa, mechanisms: rows, flaggedCount, unresolvedFlags };
}
