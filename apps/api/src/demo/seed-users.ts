import type { DataSource } from 'typeorm';
import type { SiteRole } from '@cribra/contracts';
import { hashPassword } from '../users/password-hasher';
import { UserEntity } from '../users/user.entity';
import { normalizeEmail } from '../users/users.service';

export interface DemoUser {
  email: string;
  displayName: string;
  password: string;
  siteRole: SiteRole;
}

/**
 * Creates the demo accounts that do not exist yet. Existing ones are left alone (a password the
 * user changed stays changed), so running it on every start is harmless.
 */
export async function seedDemoUsers(ds: DataSource, users: DemoUser[]): Promise<{ created: string[] }> {
  const repo = ds.getRepository(UserEntity);
  const created: string[] = [];
  for (const u of users) {
    const email = normalizeEmail(u.email);
    if (await repo.exists({ where: { email } })) continue;
    await repo.insert({ email, displayName: u.displayName, siteRole: u.siteRole, passwordHash: await hashPassword(u.password) });
    created.push(email);
  }
  return { created };
}
