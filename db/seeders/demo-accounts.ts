/**
 * The invented demo team (README, "Demo accounts"). Demo data only: the password is public, and seeding
 * refuses to run in production.
 */
export const DEMO_PASSWORD = 'loadbearing-demo';
export const DEMO_TEAM = { name: 'Granite Hollow Training Lab', slug: 'granite-hollow' };

export const DEMO_ACCOUNTS = [
  { email: 'owner@granite-hollow.test', name: 'Maren Holt', role: 'owner', title: 'physiotherapist, lead' },
  { email: 'coach@granite-hollow.test', name: 'Tobias Wren', role: 'coach', title: 'climbing coach' },
  { email: 'coach2@granite-hollow.test', name: 'Ilse Okafor', role: 'coach', title: 'strength coach' },
  { email: 'reviewer@granite-hollow.test', name: 'Priya Castellan', role: 'reviewer', title: 'peer reviewer' },
  { email: 'athlete@granite-hollow.test', name: 'Jonah Vale', role: 'athlete', title: 'boulderer' },
  { email: 'athlete2@granite-hollow.test', name: 'Sofie Lindqvist', role: 'athlete', title: 'sport climber' },
] as const;
