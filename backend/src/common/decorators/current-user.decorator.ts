import { createParamDecorator, type ExecutionContext } from '@nestjs/common';
import type { Role } from '@meritline/shared';

export interface AuthUser {
  id: string;
  email: string;
  name: string;
  roles: Role[];
}

export const CurrentUser = createParamDecorator(
  (_data: unknown, context: ExecutionContext): AuthUser => context.switchToHttp().getRequest().user,
);
