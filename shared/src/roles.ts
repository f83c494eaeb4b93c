export enum Role {
  Analyst = 'analyst',
  Reviewer = 'reviewer',
  QualityManager = 'quality_manager',
  Admin = 'admin',
}

export const ALL_ROLES: readonly Role[] = Object.values(Role);

export const ROLE_LABELS: Record<Role, string> = {
  [Role.Analyst]: 'Analyst',
  [Role.Reviewer]: 'Reviewer',
  [Role.QualityManager]: 'Quality manager',
  [Role.Admin]: 'Administrator',
};

export function hasAnyRole(userRoles: readonly string[], allowed: readonly Role[]): boolean {
  return allowed.some((role) => userRoles.includes(role));
}
