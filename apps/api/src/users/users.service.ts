import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { SiteRole } from '@cribra/contracts';
import { UserEntity } from './user.entity';
import { hashPassword, verifyPassword } from './password-hasher';

export function normalizeEmail(email: string): string {
  return email.trim().toLowerCase();
}

@Injectable()
export class UsersService {
  constructor(@InjectRepository(UserEntity) private readonly users: Repository<UserEntity>) {}

  findById(id: string): Promise<UserEntity | null> {
    return this.users.findOne({ where: { id } });
  }

  findByEmail(email: string): Promise<UserEntity | null> {
    return this.users.findOne({ where: { email: normalizeEmail(email) } });
  }

  list(): Promise<UserEntity[]> {
    return this.users.find({ order: { createdAt: 'ASC', email: 'ASC' } });
  }

  /** @throws ConflictException when the address is already registered. */
  async create(input: { email: string; password: string; displayName: string; siteRole?: SiteRole }): Promise<UserEntity> {
    const email = normalizeEmail(input.email);
    if (await this.users.exists({ where: { email } })) {
      throw new ConflictException('An account with this e-mail address already exists');
    }
    const entity = this.users.create({
      email,
      displayName: input.displayName.trim(),
      passwordHash: await hashPassword(input.password),
      siteRole: input.siteRole ?? 'member',
    });
    try {
      const saved = await this.users.save(entity);
      return (await this.findById(saved.id))!;
    } catch (err) {
      if ((err as { code?: string }).code === '23505') {
        throw new ConflictException('An account with this e-mail address already exists');
      }
      throw err;
    }
  }

  /** Returns the user when the password matches, else null (same cost either way). */
  async checkCredentials(email: string, password: string): Promise<UserEntity | null> {
    const row = await this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email: normalizeEmail(email) })
      .getOne();
    if (!row) {
      await hashPassword(password); // spend the same time as a real check, so timing does not reveal accounts
      return null;
    }
    return (await verifyPassword(row.passwordHash, password)) ? row : null;
  }

  async setPassword(userId: string, password: string): Promise<void> {
    await this.users.update({ id: userId }, { passwordHash: await hashPassword(password) });
  }

  /** @throws NotFoundException for an unknown id. */
  async updateDisplayName(userId: string, displayName: string): Promise<UserEntity> {
    const result = await this.users.update({ id: userId }, { displayName: displayName.trim() });
    if (!result.affected) throw new NotFoundException('No user with this id');
    return (await this.findById(userId))!;
  }

  /** @throws NotFoundException for an unknown id; ConflictException when it would remove the last admin. */
  async setRole(userId: string, siteRole: SiteRole): Promise<UserEntity> {
    const user = await this.findById(userId);
    if (!user) throw new NotFoundException('No user with this id');
    if (user.siteRole === 'admin' && siteRole !== 'admin') {
      const admins = await this.users.count({ where: { siteRole: 'admin' } });
      if (admins <= 1) throw new ConflictException('At least one admin must remain');
    }
    await this.users.update({ id: userId }, { siteRole });
    return (await this.findById(userId))!;
  }
}
