import type { UserDto } from './users.js';

export interface LoginResponse {
  accessToken: string;
  user: Pick<UserDto, 'id' | 'email' | 'name' | 'roles'>;
}

/** The signed-in person as `GET /api/auth/me` answers. */
export type CurrentUser = LoginResponse['user'];
