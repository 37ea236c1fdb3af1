import { describe, expect, it } from 'vitest';
import { ensureDebianPackages, installCommand, planInstall, type DebianPackage, type System } from './debian';

describe('planInstall: what is missing -> which command', () => {
  it('does nothing when nothing is missing', () => {
    expect(planInstall([], { root: false, sudo: false }, 'npm test')).toEqual({ kind: 'nothing' });
  });
  it('runs apt-get directly as root, each package once', () => {
    expect(planInstall(['postgresql', 'chromium', 'postgresql'], { root: true, sudo: false }, 'npm test')).toEqual({
      kind: 'install',
      packages: ['postgresql', 'chromium'],
      prefix: [],
    });
  });
  it('uses sudo without a prompt when sudo -n works', () => {
    expect(planInstall(['python3-networkx'], { root: false, sudo: true }, 'npm test')).toEqual({
      kind: 'install',
      packages: ['python3-networkx'],
      prefix: ['sudo', '-n'],
    });
  });
  it('without root and sudo, stops with the exact command to run', () => {
    const plan = planInstall(['chromium', 'python3-networkx'], { root: false, sudo: false }, 'npm test');
    expect(plan.kind).toBe('cannot');
    if (plan.kind !== 'cannot') return;
    expect(plan.message).toContain('npm test needs Debian\'s "chromium", "python3-networkx"');
    expect(plan.message).toContain('sudo apt-get update && sudo apt-get install -y chromium python3-networkx');
    expect(installCommand(['postgresql'])).toBe('sudo apt-get update && sudo apt-get install -y postgresql');
  });
});

/** A machine with some packages on it, whose apt-get can be made to fail until updated. */
function fakeSystem(opts: { have: DebianPackage[]; root?: boolean; sudo?: boolean; staleLists?: boolean }) {
  const have = new Set(opts.have);
  let updated = !opts.staleLists;
  const ran: string[] = [];
  const sys: System = {
    present: (p) => have.has(p),
    privileges: () => ({ root: !!opts.root, sudo: !!opts.sudo }),
    run: (argv) => {
      ran.push(argv.join(' '));
      const args = argv.slice(argv.indexOf('apt-get') + 1);
      if (args[0] === 'update') updated = true;
      if (args[0] === 'install') {
        if (!updated) return false;
        for (const p of args.slice(3)) have.add(p as DebianPackage);
      }
      return true;
    },
  };
  return { sys, ran };
}

describe('ensureDebianPackages', () => {
  it('runs nothing when everything is there', () => {
    const { sys, ran } = fakeSystem({ have: ['postgresql', 'chromium'] });
    ensureDebianPackages(['postgresql', 'chromium'], 'npm test', sys);
    expect(ran).toEqual([]);
  });
  it('installs only what is missing, as root', () => {
    const { sys, ran } = fakeSystem({ have: ['postgresql'], root: true });
    ensureDebianPackages(['postgresql', 'chromium', 'python3-networkx'], 'npm test', sys);
    expect(ran).toEqual(['apt-get install -y -qq chromium python3-networkx']);
  });
  it('updates the package lists when the install cannot find the package, then tries again (through sudo)', () => {
    const { sys, ran } = fakeSystem({ have: [], sudo: true, staleLists: true });
    ensureDebianPackages(['chromium'], 'npm test', sys);
    expect(ran).toEqual(['sudo -n apt-get install -y -qq chromium', 'sudo -n apt-get update -qq', 'sudo -n apt-get install -y -qq chromium']);
  });
  it('throws the message with the command when it may not install, and runs nothing', () => {
    const { sys, ran } = fakeSystem({ have: [] });
    expect(() => ensureDebianPackages(['postgresql'], 'npm start', sys)).toThrow('sudo apt-get update && sudo apt-get install -y postgresql');
    expect(ran).toEqual([]);
  });
});
