import { describe, expect, it } from 'vitest';
import { ACTIONS, decide, type Action, type Actor, type Decision, type Resource } from '@/lib/auth/policy';
import type { Role } from '@/models/roles';

const TEAM = 1;
const OTHER_TEAM = 2;
const ME = 10;
const SOMEONE_ELSE = 11;

const actorWith = (role: Role): Actor => ({
  userId: ME,
  roles: new Map([
    [TEAM, role],
    [OTHER_TEAM + 100, 'owner'],
  ]),
});

type Row = Record<Role, Decision>;
const A: Decision = 'allow';
const F: Decision = 'forbidden';
const N: Decision = 'not_found';

/**
 * The expected decision of every action for every role, on a resource of the caller's team that
 * someone else wrote, to which the caller is not invited. Adding an action to the policy without
 * a row here fails the completeness test below.
 */
const EXPECTED: Record<Action, Row> = {
  'team.read': { owner: A, coach: A, reviewer: A, athlete: A },
  'team.members.list': { owner: A, coach: F, reviewer: F, athlete: F },
  'team.members.invite': { owner: A, coach: F, reviewer: F, athlete: F },
  'team.members.update': { owner: A, coach: F, reviewer: F, athlete: F },
  'team.members.remove': { owner: A, coach: F, reviewer: F, athlete: F },
  'team.audit.read': { owner: A, coach: F, reviewer: F, athlete: F },
  'team.settings.update': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.list': { owner: A, coach: A, reviewer: A, athlete: F },
  'review.read': { owner: A, coach: A, reviewer: A, athlete: F },
  'review.create': { owner: A, coach: A, reviewer: F, athlete: F },
  'review.update': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.delete': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.round.open': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.round.scorecard': { owner: N, coach: N, reviewer: N, athlete: N },
  'review.round.agreement': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.round.settle': { owner: A, coach: F, reviewer: F, athlete: F },
  'review.round.read': { owner: A, coach: N, reviewer: N, athlete: N },
  'review.round.comment': { owner: A, coach: N, reviewer: N, athlete: N },
  'review.publish': { owner: A, coach: F, reviewer: F, athlete: F },
  'study.read': { owner: A, coach: A, reviewer: A, athlete: F },
  'study.write': { owner: A, coach: A, reviewer: F, athlete: F },
  'verdict.read': { owner: A, coach: A, reviewer: A, athlete: A },
  'search.read': { owner: A, coach: A, reviewer: A, athlete: F },
  'evidence.watch.run': { owner: A, coach: A, reviewer: F, athlete: F },
  'evidence.watch.read': { owner: A, coach: A, reviewer: A, athlete: F },
  'evidence.dryrun.read': { owner: A, coach: A, reviewer: F, athlete: F },
  'evidence.suggestion.dismiss': { owner: A, coach: F, reviewer: F, athlete: F },
};

const ROLES: Role[] = ['owner', 'coach', 'reviewer', 'athlete'];
const theirs: Resource = { teamId: TEAM, authorId: SOMEONE_ELSE };

describe('policy: every action × role', () => {
  it('has an expectation row for every action, and no row for an action that does not exist', () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ACTIONS].sort());
  });

  for (const action of ACTIONS) {
    for (const role of ROLES) {
      it(`${action} as ${role} → ${EXPECTED[action][role]}`, () => {
        expect(decide(actorWith(role), action, theirs)).toBe(EXPECTED[action][role]);
      });
    }
    it(`${action} by a member of another team → not_found`, () => {
      const outsider: Actor = { userId: ME, roles: new Map([[OTHER_TEAM, 'owner']]) };
      expect(decide(outsider, action, theirs)).toBe('not_found');
    });
    it(`${action} signed out → unauthorized`, () => {
      expect(decide(null, action, theirs)).toBe('unauthorized');
    });
  }
});

describe('policy: relations that change the answer', () => {
  const mine: Resource = { teamId: TEAM, authorId: ME };

  it.each(['review.update', 'review.delete', 'review.round.open', 'review.round.agreement'] as const)(
    '%s: a coach may act on their own review, a reviewer may not',
    (action) => {
      expect(decide(actorWith('coach'), action, mine)).toBe('allow');
      expect(decide(actorWith('reviewer'), action, mine)).toBe('forbidden');
    },
  );

  it('scorecard: an invited reviewer may fill it in', () => {
    expect(decide(actorWith('reviewer'), 'review.round.scorecard', { ...theirs, invited: true })).toBe('allow');
  });

  it('agreement: an invited reviewer sees it only after submitting', () => {
    expect(decide(actorWith('reviewer'), 'review.round.agreement', { ...theirs, invited: true })).toBe('forbidden');
    expect(decide(actorWith('reviewer'), 'review.round.agreement', { ...theirs, invited: true, submitted: true })).toBe(
      'allow',
    );
  });

  it('round comments: the author and invited reviewers take part; settling stays with the author and owner', () => {
    expect(decide(actorWith('coach'), 'review.round.comment', mine)).toBe('allow');
    expect(decide(actorWith('coach'), 'review.round.read', mine)).toBe('allow');
    expect(decide(actorWith('reviewer'), 'review.round.read', { ...theirs, invited: true })).toBe('allow');
    expect(decide(actorWith('reviewer'), 'review.round.comment', { ...theirs, invited: true })).toBe('allow');
    expect(decide(actorWith('coach'), 'review.round.settle', mine)).toBe('allow');
    expect(decide(actorWith('reviewer'), 'review.round.settle', { ...theirs, invited: true, submitted: true })).toBe(
      'forbidden',
    );
  });

  it('publish: a coach only where the team lets coaches publish', () => {
    expect(decide(actorWith('coach'), 'review.publish', { ...theirs, coachesMayPublish: true })).toBe('allow');
    expect(decide(actorWith('reviewer'), 'review.publish', { ...theirs, coachesMayPublish: true })).toBe('forbidden');
  });
});
