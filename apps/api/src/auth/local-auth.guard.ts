import { ExecutionContext, Injectable } from '@nestjs/common';
import { AuthGuard } from '@nestjs/passport';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import type { Request } from 'express';
import { validationException } from '../common/pipes/validation';
import { SignInDto } from './dto/sign-in.dto';

/**
 * Checks the body like the validation pipe would (guards run before pipes), then runs passport-local.
 * The session itself is started by the controller on a regenerated id.
 */
@Injectable()
export class LocalAuthGuard extends AuthGuard('local') {
  override async canActivate(context: ExecutionContext): Promise<boolean> {
    const req = context.switchToHttp().getRequest<Request>();
    const errors = await validate(plainToInstance(SignInDto, req.body ?? {}), { whitelist: true, forbidNonWhitelisted: true });
    if (errors.length) throw validationException(errors);
    return (await super.canActivate(context)) as boolean;
  }
}
