import { once } from 'node:events';
import path from 'node:path';
import connectSqlite3 from 'connect-sqlite3';
import type { RequestHandler } from 'express';
import session, { type Store } from 'express-session';
import sqlite3 from 'sqlite3';

export const SESSION_COOKIE = 'taulens.sid';
const SESSION_IDLE_ms = 12 * 60 * 60 * 1000;

export interface SessionStore {
  store: Store;
  close(): Promise<void>;
}

/** Sessions live in their own SQLite file under dataDir, so they survive restarts. */
export async function openSessionStore(dataDir: string): Promise<SessionStore> {
  const db = new sqlite3.Database(path.join(dataDir, 'sessions.sqlite'));
  const SQLiteStore = connectSqlite3(session);
  // connect-sqlite3 0.9.18 accepts an open sqlite3 connection as `db` (its typings still say
  // string); owning the connection lets shutdown close it.
  const store = new SQLiteStore({ db: db as unknown as string, table: 'sessions' }) as unknown as Store & {
    client: NodeJS.EventEmitter;
  };
  await once(store.client, 'connect');
  return {
    store,
    close: () => new Promise<void>((resolve, reject) => db.close((error) => (error ? reject(error) : resolve()))),
  };
}

/** httpOnly, SameSite=Lax cookie; Secure when users reach us over https. Idle sessions end after 12 h. */
export function sessionMiddleware(options: { store: Store; secret: string; secureCookies: boolean }): RequestHandler {
  return session({
    name: SESSION_COOKIE,
    store: options.store,
    secret: options.secret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: options.secureCookies, maxAge: SESSION_IDLE_ms },
  });
}
