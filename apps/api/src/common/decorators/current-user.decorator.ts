import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { Request } from 'express';
import type { UserEntity } from '../../users/user.entity';

/** The signed-in user (a fresh row loaded per request); use together with SignedInGuard. */
export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): UserEntity => {
  return ctx.switchToHttp().getRequest<Request>().user as UserEntity;
});
