/**
 * Durability: the PostgreSQL that npm start runs keeps fsync on; only the
 * test setup turns it off, and says so.
 */
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DURABLE, FAST_FOR_TESTS, serverOptions } from '@/scripts/lib/postgres';
import { START_CLUSTER } from '@/scripts/start';

const ROOT = path.resolve(__dirname, '..', '..', '..');

describe('local PostgreSQL options', () => {
  it('npm start runs it with fsync on', () => {
    expect(START_CLUSTER).toEqual({ fsync: true });
    const opts = serverOptions(54321, '/tmp/sockets', START_CLUSTER);
    expect(opts).toContain('-c fsync=on');
    expect(opts).not.toMatch(/fsync=off|synchronous_commit=off|full_page_writes=off/);
    expect(opts).toContain('-c listen_addresses=127.0.0.1');
    expect(opts).toContain('-p 54321');
  });

  it('the tests turn fsync off, explicitly, and nothing else does', () => {
    expect(serverOptions(54321, '/tmp/sockets', FAST_FOR_TESTS)).toContain('-c fsync=off');
    expect(DURABLE.fsync).toBe(true);
    expect(fs.readFileSync(path.join(ROOT, 'test', 'setup', 'database.ts'), 'utf8')).toMatch(/cluster: FAST_FOR_TESTS/);
    // the start path asks for the durable settings by name
    expect(fs.readFileSync(path.join(ROOT, 'scripts', 'start.ts'), 'utf8')).toMatch(/resolveDatabaseUrl\('headwater', \{ cluster: START_CLUSTER \}\)/);
  });
});
