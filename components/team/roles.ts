import type { BadgeTone } from '@/components/ui/Badge';
import { ROLES, type Role } from '@/models/roles';

/**
 * How each role reads on screen (docs/architecture.md, "The roles"): its name, what it lets a person do
 * said to them ("you …"), and the same said about the role ("a coach …").
 */
export const ROLE_INFO: Record<Role, { label: string; youCan: string; summary: string; tone: BadgeTone }> = {
  owner: {
    label: 'Owner',
    youCan: 'run the team, invite people and publish verdicts',
    summary: 'runs the team, invites people and publishes verdicts',
    tone: 'brand',
  },
  coach: {
    label: 'Coach',
    youCan: 'write claim reviews, link studies and appraise them',
    summary: 'writes claim reviews, links studies and appraises them',
    tone: 'accent',
  },
  reviewer: {
    label: 'Peer reviewer',
    youCan: 'score other coaches’ mechanisms blind and sign off',
    summary: 'scores other coaches’ mechanisms blind and signs off',
    tone: 'warning',
  },
  athlete: {
    label: 'Athlete',
    youCan: 'read the team’s published verdicts',
    summary: 'reads the team’s published verdicts',
    tone: 'neutral',
  },
};

export const ROLE_OPTIONS = ROLES.map((value) => ({ value, label: ROLE_INFO[value].label }));
