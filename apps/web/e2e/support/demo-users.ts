import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { repoRoot } from './env';

export interface DemoUser {
  email: string;
  displayName: string;
  password: string;
  siteRole: 'admin' | 'member';
}

/** The demo accounts the launcher seeds from seeds-demo/users.json. */
export function demoUsers(): DemoUser[] {
  const { users } = JSON.parse(readFileSync(join(repoRoot, 'seeds-demo/users.json'), 'utf8')) as { users: DemoUser[] };
  if (!users?.length) throw new Error('seeds-demo/users.json lists no users');
  return users;
}

export function demoUser(pick: (u: DemoUser) => boolean): DemoUser {
  const user = demoUsers().find(pick);
  if (!user) throw new Error('No demo user matches the test’s need in seeds-demo/users.json');
  return user;
}
