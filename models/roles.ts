/** The roles a person can hold in a team (PRODUCT.md, "Who uses it"). */
export const ROLES = ['owner', 'coach', 'reviewer', 'athlete'] as const;
export type Role = (typeof ROLES)[number];
