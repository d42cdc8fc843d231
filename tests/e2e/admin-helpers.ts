// Shared by the admin screens' specs: the test database for setting scenes and cleaning up, the 1366×768 gate
// terminal size, and an axe check of the page's main region.
import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';
import mysql from 'mysql2/promise';

export const GATE_TERMINAL = { width: 1366, height: 768 };

export async function db() {
  return mysql.createConnection({ uri: (process.env.DATABASE_URL ?? '').replace(/^mariadb:/, 'mysql:'), timezone: 'Z' });
}

export async function sql<T = unknown>(query: string, params: unknown[] = []): Promise<T[]> {
  const conn = await db();
  try {
    const [rows] = await conn.query(query, params);
    return rows as T[];
  } finally {
    await conn.end();
  }
}

/** A calendar date n days from now (UTC), for flights that stay off today's board. */
export const daysAhead = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

/** Four digits and a letter no demo flight uses, so a spec's flights are its own. */
export const freshNumber = (suffix: string) => `${1000 + Math.floor(Math.random() * 8999)}${suffix}`;

export async function expectNoAxeViolations(page: Page) {
  const result = await new AxeBuilder({ page }).include('main').analyze();
  expect(result.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
}
