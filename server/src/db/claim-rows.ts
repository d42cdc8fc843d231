// How a worker takes rows that only one process may work on at a time (mail to send, a card to issue, a transfer to
// send). A claim is a lease: in one short transaction the claimer locks due rows with FOR UPDATE SKIP LOCKED (rows
// another claimer is taking right now are passed over, not waited for), stamps them with a token of this claim and
// a lease end, and commits; the work (a network call) then runs without any lock held. Every write that ends the
// claim is fenced on the token, so a claimer whose lease ran out (it hung, or died and another took the row) can
// never record over the newer claim. A dead claimer's rows are due again once their lease ends.
//
// The table carries two columns for this: `claimed_by` varchar(96) NULL and `lease_until` datetime(3) NULL.
import { randomUUID } from 'node:crypto';
import { hostname } from 'node:os';
import type { DataSource } from 'typeorm';

/** Names one claimer (a worker in one process) in `claimed_by`; tests make two on one database. */
export function newClaimerId(): string {
  return `${hostname().slice(0, 40)}:${process.pid}:${randomUUID().slice(0, 8)}`;
}

export interface ClaimableTable {
  /** A table name of ours (never user input: it goes into the SQL as written). */
  table: string;
  /** The column that names a row. */
  key: string;
}

export interface ClaimRequest {
  /** At most this many rows. */
  limit: number;
  /** How long the claim keeps everyone else off the rows: longer than the work can take. */
  leaseMs: number;
  /** SQL condition for rows with work due, on the table's own columns; the claim condition is added to it. */
  due: string;
  dueParams?: unknown[];
  /** Only these rows (a route asking for one row it just made due). */
  keys?: readonly (string | number)[];
  /** Which due rows first; default the key. */
  orderBy?: string;
  /** Columns returned with each row; default the key alone. */
  columns?: string;
  /** More to set on the claimed rows in the same statement (e.g. counting an attempt). */
  alsoSet?: string;
}

export interface Claim<Row> {
  /** Stamped on the rows while the claim holds; the fence of every write that ends it. */
  token: string;
  rows: Row[];
}

export interface RowClaimer {
  readonly claimer: string;
  claim<Row extends Record<string, unknown>>(request: ClaimRequest): Promise<Claim<Row>>;
  /**
   * Ends the claim on one row, setting `set` (with `params`) in the same fenced statement. False when the claim no
   * longer holds (the lease ran out and someone else took the row): then nothing was written.
   */
  finish(token: string, key: string | number, set?: string, params?: unknown[]): Promise<boolean>;
}

const NOT_CLAIMED = '(lease_until IS NULL OR lease_until < UTC_TIMESTAMP(3))';

/** Counts the claims of this process, so no two claims here share a token, whichever claimer object made them. */
let claimsMade = 0;

export function rowClaimer(db: DataSource, spec: ClaimableTable, claimer: string = newClaimerId()): RowClaimer {
  const { table, key } = spec;

  return {
    claimer,

    async claim<Row extends Record<string, unknown>>(request: ClaimRequest): Promise<Claim<Row>> {
      claimsMade += 1;
      const token = `${claimer}/${claimsMade}`;
      if (request.limit <= 0 || request.keys?.length === 0) return { token, rows: [] };
      const only = request.keys ? `AND ${key} IN (?)` : '';
      const params = [...(request.dueParams ?? []), ...(request.keys ? [request.keys] : []), request.limit];
      // READ COMMITTED: no gap locks, so a claim never holds up the inserts that make new rows due.
      const rows = await db.transaction('READ COMMITTED', async (em) => {
        const found: Row[] = await em.query(
          `SELECT ${request.columns ?? key} FROM ${table}
            WHERE (${request.due}) AND ${NOT_CLAIMED} ${only}
            ORDER BY ${request.orderBy ?? key} LIMIT ? FOR UPDATE SKIP LOCKED`,
          params,
        );
        if (found.length === 0) return found;
        const keys = found.map((row) => row[key]);
        if (keys.some((k) => k === undefined)) throw new Error(`claim on ${table}: the columns returned must include ${key}`);
        await em.query(
          `UPDATE ${table} SET claimed_by = ?, lease_until = UTC_TIMESTAMP(3) + INTERVAL ? MICROSECOND${request.alsoSet ? `, ${request.alsoSet}` : ''}
            WHERE ${key} IN (?)`,
          [token, Math.round(request.leaseMs * 1000), keys],
        );
        return found;
      });
      return { token, rows };
    },

    async finish(token, rowKey, set, params = []) {
      const result: { affectedRows?: number } = await db.query(
        `UPDATE ${table} SET ${set ? `${set}, ` : ''}claimed_by = NULL, lease_until = NULL WHERE ${key} = ? AND claimed_by = ?`,
        [...params, rowKey, token],
      );
      return result.affectedRows === 1;
    },
  };
}
