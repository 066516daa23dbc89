import { Badge } from '@/components/ui/Badge';
import type { Role } from '@/models/roles';
import { ROLE_INFO } from './roles';

export function RoleBadge({ role }: { role: Role }) {
  return <Badge tone={ROLE_INFO[role].tone}>{ROLE_INFO[role].label}</Badge>;
}
