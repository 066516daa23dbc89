/** The roles a person can hold in a team (docs/architecture.md, "The roles"). */
export const ROLES = ['owner', 'coach', 'reviewer', 'athlete'] as const;
export type Role = (typeof ROLES)[number];
