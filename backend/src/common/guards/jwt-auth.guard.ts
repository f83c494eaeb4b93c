import { ForbiddenException, Injectable, UnauthorizedException, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { isCrossSiteChange } from '../../auth/session-cookie.js';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator.js';

@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  canActivate(context: ExecutionContext) {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    if (isCrossSiteChange(context.switchToHttp().getRequest())) {
      throw new ForbiddenException('This change was not sent by the Meritline web app. Reload the page and try again.');
    }
    return super.canActivate(context);
  }

  /** Passport's bare "Unauthorized" for a missing, malformed or forged token says nothing a caller can act on. */
  handleRequest<TUser>(error: unknown, user: TUser | false): TUser {
    if (error) throw error;
    if (!user) throw new UnauthorizedException('Sign in first: the request carries no valid session token.');
    return user;
  }
}
