/**
 * The demo accounts (scripts/demo/users.json), for a local try-out only.
 *
 * With DEMO=1 each missing demo account is created with its listed password;
 * an existing one keeps its password and role (someone may have changed
 * them) and is enabled again if a DEMO=0 start had disabled it. With DEMO=0
 * no demo account may be used: any left over from an earlier demo run is
 * disabled and its sessions end. The server then listens on 127.0.0.1 only
 * while DEMO=1 (server/server.ts), since the passwords are printed and public.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Role } from '@/shared/api';
import { REPO_ROOT } from '../config';
import { User } from '../db/models/user';
import { hashPassword } from '../auth/passwords';
import { findUserByEmail } from './users';

export interface DemoUser {
  email: string;
  name: string;
  role: Role;
  password: string;
}

export const DEMO_USERS_FILE = path.join(REPO_ROOT, 'scripts', 'demo', 'users.json');
export const DEMO_USERS: DemoUser[] = JSON.parse(fs.readFileSync(DEMO_USERS_FILE, 'utf8')).users;

export interface DemoAccountsResult {
  created: string[];
  /** existing accounts left with their own password and role */
  kept: string[];
  /** disabled accounts enabled again (DEMO=1) */
  enabled: string[];
  /** accounts disabled because DEMO=0 */
  disabled: string[];
}

export async function applyDemoAccounts(demo: boolean, users: readonly DemoUser[] = DEMO_USERS): Promise<DemoAccountsResult> {
  const result: DemoAccountsResult = { created: [], kept: [], enabled: [], disabled: [] };
  for (const u of users) {
    const existing = await findUserByEmail(u.email);
    if (!demo) {
      if (existing && !existing.disabled) {
        await existing.update({ disabled: true, tokenVersion: existing.tokenVersion + 1 });
        result.disabled.push(existing.email);
      }
      continue;
    }
    if (!existing) {
      await User.create({ email: u.email, name: u.name, role: u.role, passwordHash: await hashPassword(u.password) });
      result.created.push(u.email);
    } else if (existing.disabled) {
      await existing.update({ disabled: false });
      result.enabled.push(existing.email);
    } else {
      result.kept.push(existing.email);
    }
  }
  return result;
}

/** Where the server listens: this machine only while the demo accounts are open. */
export const listenHost = (demo: boolean) => (demo ? '127.0.0.1' : '0.0.0.0');
