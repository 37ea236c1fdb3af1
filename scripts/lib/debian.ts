/**
 * Debian packages the project needs from the operating system, installed when
 * missing: by `npm start` (PostgreSQL) and `npm test` (PostgreSQL, Chromium,
 * python3-networkx). As root apt-get runs directly; otherwise through sudo
 * when sudo works without a password prompt; otherwise nothing is installed
 * and the error names the exact command to run.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

export type DebianPackage = 'postgresql' | 'chromium' | 'python3-networkx';

/** The PostgreSQL server's newest bin folder (/usr/lib/postgresql/N/bin), or null. */
export function findPostgresBinDir(): string | null {
  const base = '/usr/lib/postgresql';
  if (!fs.existsSync(base)) return null;
  const versions = fs
    .readdirSync(base)
    .filter((v) => fs.existsSync(path.join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

/** Where the browser tests look for Chromium (CHROMIUM_PATH overrides Debian's path). */
export const chromiumPath = () => process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

function pythonHasNetworkx(): boolean {
  return ['/usr/bin/python3', 'python3'].some((py) => spawnSync(py, ['-c', 'import networkx'], { stdio: 'ignore', timeout: 30_000 }).status === 0);
}

/** Whether each package's part is on this machine already. */
export const present: Record<DebianPackage, () => boolean> = {
  postgresql: () => findPostgresBinDir() !== null,
  chromium: () => fs.existsSync(chromiumPath()),
  'python3-networkx': pythonHasNetworkx,
};

export interface Privileges {
  root: boolean;
  /** sudo runs without asking for a password (`sudo -n true` succeeds) */
  sudo: boolean;
}

export type InstallPlan =
  | { kind: 'nothing' }
  | { kind: 'install'; packages: DebianPackage[]; prefix: string[] }
  | { kind: 'cannot'; packages: DebianPackage[]; message: string };

/** The command that installs `packages`, as a person would type it. */
export const installCommand = (packages: DebianPackage[]) => `sudo apt-get update && sudo apt-get install -y ${packages.join(' ')}`;

/** What to do about the missing packages, given who we run as. Pure: the unit tests call it. */
export function planInstall(missing: DebianPackage[], who: Privileges, purpose: string): InstallPlan {
  const packages = [...new Set(missing)];
  if (packages.length === 0) return { kind: 'nothing' };
  if (who.root) return { kind: 'install', packages, prefix: [] };
  if (who.sudo) return { kind: 'install', packages, prefix: ['sudo', '-n'] };
  return {
    kind: 'cannot',
    packages,
    message:
      `${purpose} needs Debian's ${packages.map((p) => `"${p}"`).join(', ')} ` +
      `(not on this machine), and this user can neither install packages (not root) nor use sudo without a password. ` +
      `Run this once, then try again:\n\n  ${installCommand(packages)}\n`,
  };
}

export function currentPrivileges(): Privileges {
  const root = typeof process.getuid === 'function' && process.getuid() === 0;
  if (root) return { root, sudo: false };
  const sudo = spawnSync('sudo', ['-n', 'true'], { stdio: 'ignore', timeout: 10_000 }).status === 0;
  return { root, sudo };
}

function log(msg: string) {
  process.stderr.write(`[debian] ${msg}\n`);
}

/** The machine as ensureDebianPackages sees it; the unit tests pass a stand-in. */
export interface System {
  present: (p: DebianPackage) => boolean;
  privileges: () => Privileges;
  /** run a command with its output shown; true when it exits 0 */
  run: (argv: string[]) => boolean;
}

const realSystem: System = {
  present: (p) => present[p](),
  privileges: currentPrivileges,
  run: ([cmd, ...args]) => spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } }).status === 0,
};

/**
 * Install whichever of `wanted` is missing, or throw with the command to run.
 * apt-get install first; when it fails (the package lists are stale or were
 * never fetched, as on a fresh container), apt-get update and once more.
 */
export function ensureDebianPackages(wanted: DebianPackage[], purpose: string, sys: System = realSystem) {
  const missing = wanted.filter((p) => !sys.present(p));
  if (missing.length === 0) return;
  const plan = planInstall(missing, sys.privileges(), purpose);
  if (plan.kind === 'nothing') return;
  if (plan.kind === 'cannot') throw new Error(plan.message);
  log(`installing ${plan.packages.join(', ')} (missing on this machine)`);
  const apt = (args: string[]) => sys.run([...plan.prefix, 'apt-get', ...args]);
  const install = ['install', '-y', '-qq', ...plan.packages];
  if (!apt(install)) {
    apt(['update', '-qq']);
    if (!apt(install)) throw new Error(`could not install ${plan.packages.join(', ')}; try: ${installCommand(plan.packages)}`);
  }
  const still = plan.packages.filter((p) => !sys.present(p));
  if (still.length) throw new Error(`installed ${still.join(', ')} but still cannot find ${still.map((p) => (p === 'chromium' ? chromiumPath() : p)).join(', ')}`);
}
