import bcrypt from 'bcryptjs';
import type { EntityManager } from 'typeorm';
import { Role } from '@meritline/shared';
import { User } from '../../users/user.entity.js';

export const DEMO_PASSWORD = 'meritline-demo';

export const DEMO_USERS = [
  { email: 'analyst@meritline.test', name: 'Alma Ruiz', roles: [Role.Analyst] },
  { email: 'analyst2@meritline.test', name: 'Tomasz Weber', roles: [Role.Analyst] },
  { email: 'reviewer@meritline.test', name: 'Priya Nair', roles: [Role.Reviewer] },
  { email: 'quality@meritline.test', name: 'Jonas Lindqvist', roles: [Role.QualityManager, Role.Reviewer] },
  { email: 'admin@meritline.test', name: 'Sam Okafor', roles: [Role.Admin] },
];

export async function seedDemoUsers(manager: EntityManager) {
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await manager.getRepository(User).save(DEMO_USERS.map((user) => manager.create(User, { ...user, passwordHash, active: true })));
}
