import net from 'node:net';
import { Sequelize, UniqueConstraintError, DatabaseError } from 'sequelize';
import { describe, expect, it } from 'vitest';
import { isDatabaseUnavailableError } from './unavailable';

/** A loopback port with nothing listening: bind one, note it, close it. */
async function closedPort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((r) => s.listen(0, '127.0.0.1', () => r()));
  const port = (s.address() as net.AddressInfo).port;
  await new Promise<void>((r) => s.close(() => r()));
  return port;
}

describe('isDatabaseUnavailableError', () => {
  it('recognises what Sequelize throws for a refused connection', async () => {
    const sequelize = new Sequelize(`postgres://nobody@127.0.0.1:${await closedPort()}/nothing`, { logging: false, dialect: 'postgres', pool: { max: 1, acquire: 3000 } });
    const err = await sequelize.query('SELECT 1').catch((e) => e);
    await sequelize.close();
    expect(err).toBeInstanceOf(Error);
    expect(isDatabaseUnavailableError(err)).toBe(true);
  });

  it('recognises a dropped connection and a server shutting down', () => {
    expect(isDatabaseUnavailableError(new Error('Connection terminated unexpectedly'))).toBe(true);
    const shutdown = Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' });
    expect(isDatabaseUnavailableError(new DatabaseError(shutdown as never))).toBe(true);
  });

  it('does not take a query error for an outage', () => {
    const unique = Object.assign(new Error('duplicate key'), { code: '23505' });
    expect(isDatabaseUnavailableError(new DatabaseError(unique as never))).toBe(false);
    expect(isDatabaseUnavailableError(new UniqueConstraintError({}))).toBe(false);
    expect(isDatabaseUnavailableError(new Error('some bug'))).toBe(false);
    expect(isDatabaseUnavailableError(undefined)).toBe(false);
  });
});
