import { Body, Controller, Get, HttpCode, Patch, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Request, Response } from 'express';
import type { UserView } from '@cribra/contracts';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { SignedInGuard } from '../common/guards/signed-in.guard';
import { Csrf } from '../common/middleware/csrf';
import type { UserEntity } from '../users/user.entity';
import { toUserView } from '../users/user-view';
import { UsersService } from '../users/users.service';
import { AuthService } from './auth.service';
import { ChangePasswordDto } from './dto/change-password.dto';
import { ResetConfirmDto } from './dto/reset-confirm.dto';
import { ResetRequestDto } from './dto/reset-request.dto';
import { SignInDto } from './dto/sign-in.dto';
import { SignUpDto } from './dto/sign-up.dto';
import { UpdateProfileDto } from './dto/update-profile.dto';
import { LocalAuthGuard } from './local-auth.guard';
import { endSession, SESSION_COOKIE, startSession } from './session';
import { SignInThrottlerGuard } from './sign-in-throttler.guard';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly csrf: Csrf,
    private readonly users: UsersService,
  ) {}

  @Get('csrf')
  csrfToken(@Req() req: Request, @Res({ passthrough: true }) res: Response): { token: string } {
    return { token: this.csrf.issue(req, res) };
  }

  @Post('signup')
  async signUp(@Body() dto: SignUpDto, @Req() req: Request): Promise<UserView> {
    const user = await this.auth.signUp(dto);
    await startSession(req, user.id);
    return toUserView(user);
  }

  @Post('signin')
  @HttpCode(200)
  @UseGuards(SignInThrottlerGuard, LocalAuthGuard)
  async signIn(@Body() _dto: SignInDto, @Req() req: Request): Promise<UserView> {
    const user = req.user as UserEntity;
    await startSession(req, user.id);
    return toUserView(user);
  }

  @Post('signout')
  @HttpCode(204)
  async signOut(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    await endSession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
  }

  @Get('me')
  @UseGuards(SignedInGuard)
  me(@CurrentUser() user: UserEntity): UserView {
    return toUserView(user);
  }

  @Patch('me')
  @UseGuards(SignedInGuard)
  async updateProfile(@CurrentUser() user: UserEntity, @Body() dto: UpdateProfileDto): Promise<UserView> {
    return toUserView(await this.users.updateDisplayName(user.id, dto.displayName));
  }

  @Post('password')
  @HttpCode(204)
  @UseGuards(SignedInGuard)
  async changePassword(@CurrentUser() user: UserEntity, @Body() dto: ChangePasswordDto, @Req() req: Request): Promise<void> {
    await this.auth.changePassword(user, dto.currentPassword, dto.newPassword, req.sessionID);
  }

  @Post('reset/request')
  @HttpCode(202)
  @UseGuards(SignInThrottlerGuard)
  async requestReset(@Body() dto: ResetRequestDto): Promise<void> {
    await this.auth.requestReset(dto.email);
  }

  @Post('reset/confirm')
  @HttpCode(204)
  async confirmReset(@Body() dto: ResetConfirmDto): Promise<void> {
    await this.auth.confirmReset(dto.token, dto.newPassword);
  }
}
