import { Lucia, TimeSpan } from 'lucia';
import { Mysql2Adapter } from '@lucia-auth/adapter-mysql';
import type { Pool } from 'mysql2/promise';
import type { DataSource } from 'typeorm';
import type { Role } from '@millrace/contracts';

/** Name of the session cookie. */
export const sessionCookieName = 'millrace_session';
/** A session lives this long after its last use (lucia extends it when half is used up). */
export const sessionLifetime = new TimeSpan(12, 'h');

/** Columns of `person` that lucia reads with every session (SELECT person.*). */
interface PersonColumns {
  email: string;
  name: string;
  role: Role;
  active: number | boolean;
}

/**
 * lucia v3 over @lucia-auth/adapter-mysql. The adapter runs its SQL through the TypeORM data
 * source (same mysql2 pool, same UTC time zone, same reconnect behaviour), so there is one pool
 * per process and a database outage surfaces as the usual 503.
 */
export function createLucia(dataSource: DataSource, publicUrl: string) {
  const pool = {
    query: async (sql: string, args: unknown[]) => [await dataSource.query(sql, args)],
    execute: async (sql: string, args: unknown[]) => [await dataSource.query(sql, args)],
  } as unknown as Pool;
  const adapter = new Mysql2Adapter(pool, { user: 'person', session: 'session' });
  return new Lucia(adapter, {
    sessionExpiresIn: sessionLifetime,
    sessionCookie: {
      name: sessionCookieName,
      expires: false, // a browser-session cookie; the server-side session still expires
      attributes: { secure: publicUrl.startsWith('https:'), sameSite: 'lax' },
    },
    getUserAttributes: (a) => ({
      email: a.email,
      name: a.name,
      role: a.role,
      active: a.active === true || Number(a.active) === 1,
    }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: PersonColumns;
    UserId: number;
  }
}
