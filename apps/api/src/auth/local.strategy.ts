import { Injectable, UnauthorizedException } from '@nestjs/common';
import { PassportStrategy } from '@nestjs/passport';
import { Strategy } from 'passport-local';
import { UsersService } from '../users/users.service';
import type { UserEntity } from '../users/user.entity';

/** passport-local with the e-mail as user name. */
@Injectable()
export class LocalStrategy extends PassportStrategy(Strategy, 'local') {
  constructor(private readonly users: UsersService) {
    super({ usernameField: 'email', passwordField: 'password' });
  }

  async validate(email: string, password: string): Promise<UserEntity> {
    const user = await this.users.checkCredentials(email, password);
    if (!user) throw new UnauthorizedException('Wrong e-mail address or password');
    return user;
  }
}
