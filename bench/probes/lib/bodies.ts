import { DEMO_PASSWORD } from '../../../db/seeders/demo-accounts';
import { newReview } from '../../../tests/helpers/review-input';
import type { Endpoint } from './routes';

/** One team's row ids by path parameter name, plus `reviewerId` (a coach or reviewer who is not the author). */
export type Ids = Record<string, number | string>;

/** A well-formed body per write route, the starting point of the one-field-wrong bodies. */
export function wellFormed(e: Endpoint, ids: Ids): Record<string, unknown> {
  const key = `${e.method} ${e.template}`;
  const reason = 'A reason that is long enough to be read.';
  const bodies: Record<string, Record<string, unknown>> = {
    'POST /api/auth/sign-up': {
      name: 'Fuzz',
      email: 'fuzz@example.test',
      password: 'fuzz-password-123',
      teamName: 'Fuzz',
    },
    'POST /api/auth/sign-in': { email: 'owner@granite-hollow.test', password: DEMO_PASSWORD },
    'POST /api/auth/password-reset': { email: 'owner@granite-hollow.test' },
    'POST /api/auth/password-reset/confirm': { token: 'a'.repeat(43), password: 'fuzz-password-123' },
    'POST /api/invitations/[token]/accept': { name: 'Fuzz', password: 'fuzz-password-123' },
    'POST /api/reviews': newReview(Number(ids.teamId)),
    'PATCH /api/reviews/[id]': { version: 1, title: 'Fuzz', status: 'draft', tags: ['a'] },
    'POST /api/reviews/[id]/mechanisms': { name: 'Fuzz', prior: 0.5, position: 1, desirable: 'higher' },
    'PATCH /api/reviews/[id]/mechanisms/[mechanismId]': { name: 'Fuzz', prior: 0.5 },
    'POST /api/reviews/[id]/appraisals': { studyId: ids.studyId, mechanismId: null, direction: 'supports' },
    'PATCH /api/reviews/[id]/appraisals/[appraisalId]': { direction: 'supports', notes: 'Fuzz' },
    'POST /api/reviews/[id]/comments': {
      body: 'Fuzz',
      mechanismId: null,
      parentId: ids.commentId,
      roundId: ids.roundId,
    },
    'PATCH /api/reviews/[id]/comments/[commentId]': { resolved: true },
    'POST /api/reviews/[id]/publish': { visibility: 'team', changeNote: 'Fuzz note' },
    'POST /api/reviews/[id]/unpublish': { reason },
    'POST /api/reviews/[id]/rounds': {
      reviewerIds: [ids.reviewerId],
      dueAt: new Date(Date.now() + 3 * 864e5).toISOString(),
    },
    'PUT /api/reviews/[id]/rounds/[roundId]/scorecard': {
      ratings: [{ mechanismId: ids.mechanismId, band: 3, contribution: 'small', comment: '' }],
      overallComment: '',
      signOff: 'approve',
      submit: false,
    },
    'PATCH /api/reviews/[id]/rounds/[roundId]/scorecard': { signOff: 'approve' },
    'POST /api/reviews/[id]/rounds/[roundId]/resolutions': { mechanismId: ids.mechanismId, kind: 'keep', reason },
    'POST /api/reviews/[id]/rounds/[roundId]/close': { closedWithout: [{ reviewerId: ids.reviewerId, reason }] },
    'POST /api/studies': { teamId: ids.teamId, title: 'Fuzz study', year: 2024, design: 'randomized', tags: ['a'] },
    'PATCH /api/studies/[id]': { title: 'Fuzz study', year: 2020, n: 12 },
    'POST /api/teams/[teamId]/members': { email: 'fuzz@example.test', role: 'coach' },
    'PATCH /api/teams/[teamId]/members/[membershipId]': { role: 'coach' },
  };
  return bodies[key] ?? {};
}
