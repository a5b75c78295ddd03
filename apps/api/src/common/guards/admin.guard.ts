import { CanActivate, ExecutionContext, ForbiddenException, Injectable, UnauthorizedException } from '@nestjs/common';
import type { Request } from 'express';

/** Signed-in admins only: 401 when signed out, 403 for members. */
@Injectable()
export class AdminGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    const req = context.switchToHttp().getRequest<Request>();
    if (!req.user) throw new UnauthorizedException('Sign in to continue');
    if (req.user.siteRole !== 'admin') throw new ForbiddenException('Only site admins may do this');
    return true;
  }
}
