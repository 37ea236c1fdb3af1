/**
 * Backup and restore of the whole database: the network, people, the audit
 * log, operations and document metadata, with the schema and its migration
 * record. One file in PostgreSQL's custom archive format, written by Debian's
 * pg_dump and read back by pg_restore (the client tools beside the server
 * binaries, /usr/lib/postgresql/<version>/bin). Files kept in object storage
 * are not in the database and need their own copy.
 */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { Client } from 'pg';
import { findBinDir } from './postgres';

function tool(name: 'pg_dump' | 'pg_restore'): string {
  const bin = findBinDir();
  const file = bin ? path.join(bin, name) : null;
  if (!file || !fs.existsSync(file)) {
    throw new Error(`${name} is missing: install Debian's PostgreSQL client tools (apt-get install -y postgresql-client), found under /usr/lib/postgresql/*/bin`);
  }
  return file;
}

/** The connection as libpq arguments and environment: the password never appears in a process list. */
function connectionArgs(url: string): { args: string[]; env: NodeJS.ProcessEnv } {
  const u = new URL(url);
  const database = decodeURIComponent(u.pathname.replace(/^\//, ''));
  if (!database) throw new Error('the database URL names no database');
  const args = ['--host', u.hostname || '127.0.0.1', '--port', u.port || '5432', '--dbname', database];
  if (u.username) args.push('--username', decodeURIComponent(u.username));
  const env: NodeJS.ProcessEnv = { ...process.env, PGPASSWORD: decodeURIComponent(u.password), PGCONNECT_TIMEOUT: '10' };
  return { args: [...args, '--no-password'], env };
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((resolve, reject) => {
    const p = spawn(cmd, args, { env, stdio: ['ignore', 'inherit', 'pipe'] });
    let stderr = '';
    p.stderr.on('data', (d) => (stderr += d));
    p.on('error', reject);
    p.on('exit', (code) => {
      if (code === 0) resolve();
      else reject(new Error(`${path.basename(cmd)} failed (exit ${code}): ${stderr.trim().split('\n').slice(-5).join('\n')}`));
    });
  });
}

export interface BackupSummary {
  file: string;
  bytes: number;
  ms: number;
}

/** Write the whole database to `file` (custom format, compressed); a partial file never stays behind. */
export async function backupDatabase(url: string, file: string): Promise<BackupSummary> {
  const t0 = Date.now();
  const target = path.resolve(file);
  fs.mkdirSync(path.dirname(target), { recursive: true });
  const partial = `${target}.partial`;
  const { args, env } = connectionArgs(url);
  try {
    await run(tool('pg_dump'), ['--format=custom', '--compress=6', '--file', partial, ...args], env);
    fs.renameSync(partial, target);
  } finally {
    fs.rmSync(partial, { force: true });
  }
  return { file: target, bytes: fs.statSync(target).size, ms: Date.now() - t0 };
}

/** Tables in the database's public schema: a database with none counts as empty. */
export async function tablesIn(url: string): Promise<string[]> {
  const c = new Client({ connectionString: url });
  await c.connect();
  try {
    const r = await c.query(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`);
    return r.rows.map((row) => String(row.tablename));
  } finally {
    await c.end();
  }
}

export class NotEmptyError extends Error {}

/**
 * Bring a backup back into an empty database. A database that holds tables is
 * refused unless `force`, which drops everything in it first (nothing of the
 * old contents survives). One transaction: a restore that fails leaves the
 * database as it was.
 */
export async function restoreDatabase(url: string, file: string, opts: { force?: boolean } = {}): Promise<{ ms: number; tables: number }> {
  const t0 = Date.now();
  const source = path.resolve(file);
  if (!fs.existsSync(source)) throw new Error(`no such backup file: ${source}`);
  const existing = await tablesIn(url);
  if (existing.length > 0 && !opts.force) {
    const name = decodeURIComponent(new URL(url).pathname.slice(1));
    throw new NotEmptyError(
      `the database "${name}" is not empty (${existing.length} tables, e.g. ${existing.slice(0, 3).join(', ')}): restore into an empty database, or add --force to drop everything in it first`,
    );
  }
  if (existing.length > 0) {
    const c = new Client({ connectionString: url });
    await c.connect();
    try {
      // every schema the backup may hold: public and the job queue's (pgboss), and any other a deployment added
      const { rows } = await c.query(`SELECT nspname FROM pg_namespace WHERE nspname NOT LIKE 'pg\\_%' AND nspname <> 'information_schema'`);
      for (const { nspname } of rows as { nspname: string }[]) await c.query(`DROP SCHEMA "${nspname.replace(/"/g, '""')}" CASCADE`);
      await c.query('CREATE SCHEMA public');
    } finally {
      await c.end();
    }
  }
  const { args, env } = connectionArgs(url);
  // ownership and grants are the old server's; here everything belongs to the connecting user
  await run(tool('pg_restore'), ['--no-owner', '--no-privileges', '--exit-on-error', '--single-transaction', ...args, source], env);
  return { ms: Date.now() - t0, tables: (await tablesIn(url)).length };
}
