import type { Role } from '../roles.js';

export interface UserDto {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  active: boolean;
  invitationPending: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}
