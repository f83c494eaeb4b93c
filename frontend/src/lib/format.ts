import { ROLE_LABELS, type Role } from '@meritline/shared';

export function formatRoles(roles: readonly Role[]): string {
  return roles.map((role) => ROLE_LABELS[role] ?? role).join(', ');
}

const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export function formatDateTime(iso: string | null | undefined, fallback = '—'): string {
  if (!iso) return fallback;
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? fallback : dateTime.format(date);
}
