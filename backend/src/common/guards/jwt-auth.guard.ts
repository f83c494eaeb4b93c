import { Injectable, UnauthorizedException, type CanActivate, type ExecutionContext } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { BearerTokens } from '../../auth/bearer-tokens.js';
import { SessionsService, type SessionUser } from '../../auth/sessions.service.js';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator.js';

@Injectable()
export class JwtAuthGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly tokens: BearerTokens,
    private readonly sessions: SessionsService,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const isPublic = this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
    if (isPublic) return true;
    const request = context.switchToHttp().getRequest<{ headers: Record<string, unknown>; user?: SessionUser }>();
    const payload = this.tokens.payloadOf(request);
    if (!payload) throw new UnauthorizedException('Sign in first: the request carries no valid session token.');
    request.user = await this.sessions.authenticate(payload);
    return true;
  }
}
