import { ROLE_LABELS, type Role } from '@meritline/shared';

export function formatRoles(roles: readonly Role[]): string {
  return roles.map((role) => ROLE_LABELS[role] ?? role).join(', ');
}
