import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import pg from 'pg';

/**
 * Connections for the reads the server makes on most requests (the session with its user, a list
 * page), run as named prepared statements: each connection parses and plans such a statement once
 * and then only executes it. Its plan is the generic one (made without the values, from the
 * statement's shape: index per sort, row by row by primary key), so these statements are written
 * to have one plan that suits every value. Other queries keep using Knex's pool, planned per run.
 */
export function createReadPool(databaseUrl: string, max = 10): pg.Pool {
  const pool = new pg.Pool({
    connectionString: databaseUrl,
    max,
    // Times in UTC, so that a timestamp's text is turned into ISO 8601 without a Date (isoTimestamp).
    options: '-c plan_cache_mode=force_generic_plan -c TimeZone=UTC',
    types: { getTypeParser: readTypeParser as typeof pg.types.getTypeParser },
  });
  // An idle connection the database ends (a restart, an administrator) is dropped and replaced on
  // the next read; without a listener its error would end the process.
  pool.on('error', (err) => console.error(`A read connection to PostgreSQL ended: ${err.message}`));
  return pool;
}

/** Timestamps stay text on read connections (isoTimestamp writes them as ISO 8601); other types as usual. */
function readTypeParser(oid: number, format?: 'text' | 'binary'): (value: string) => unknown {
  return oid === pg.types.builtins.TIMESTAMPTZ && format !== 'binary' ? keepText : pg.types.getTypeParser(oid, format ?? 'text');
}
const keepText = (value: string): string => value;

/** The text of a UTC timestamp as PostgreSQL writes it ("2026-12-04 05:17:37.123456+00"). */
const UTC_TIMESTAMP = /^(\d{4}-\d{2}-\d{2}) (\d{2}:\d{2}:\d{2})(?:\.(\d{1,6}))?\+00$/;

/**
 * A timestamp as ISO 8601 with milliseconds (what Date#toISOString writes), from a Date (Knex
 * connections) or from the text a read connection keeps (see readTypeParser): read pages turn 25
 * timestamps a page into strings again, so they skip the Date in between.
 */
export function isoTimestamp(value: Date | string): string {
  if (typeof value !== 'string') return value.toISOString();
  const m = UTC_TIMESTAMP.exec(value);
  if (!m) return new Date(value).toISOString();
  return `${m[1]}T${m[2]}.${(m[3] ?? '').padEnd(3, '0').slice(0, 3)}Z`;
}

/** Statement names by SQL text: one per statement shape, so the set stays small (cleared if it ever grows). */
const statementNames = new Map<string, string>();
const MAX_SHAPES = 1000;

function statementName(sql: string): string {
  let name = statementNames.get(sql);
  if (name === undefined) {
    if (statementNames.size >= MAX_SHAPES) statementNames.clear();
    name = `cc-${createHash('sha1').update(sql).digest('base64url').slice(0, 24)}`;
    statementNames.set(sql, name);
  }
  return name;
}

/** A statement written with numbered parameters ($1, $2…) and their values. */
export interface Statement {
  text: string;
  values: unknown[];
}

/**
 * Collects the values of a statement written by hand: `add(value)` answers the parameter (`$n`) to
 * write in its place. Hot statements are written this way instead of through Knex, whose building
 * and compiling cost more per request than running the statement.
 */
export class StatementParams {
  readonly values: unknown[] = [];
  add(value: unknown): string {
    this.values.push(value);
    return `$${this.values.length}`;
  }
}

/** Runs `query` on `pool` as a prepared statement named after its SQL text (so one per shape). */
export async function readPrepared<T extends pg.QueryResultRow>(pool: pg.Pool, query: Knex.QueryBuilder | Knex.Raw | Statement): Promise<T[]> {
  const { text, values } = 'toSQL' in query ? nativeOf(query) : query;
  return (await pool.query<T>({ name: statementName(text), text, values })).rows;
}

function nativeOf(query: Knex.QueryBuilder | Knex.Raw): Statement {
  const { sql, bindings } = query.toSQL().toNative();
  return { text: sql, values: bindings as unknown[] };
}

/** Runs a hand-written statement through Knex (`db`), where no read pool is at hand (tests, transactions). */
export async function runStatement<T>(db: Knex | Knex.Transaction, statement: Statement): Promise<T[]> {
  const bindings: unknown[] = [];
  const sql = statement.text.replace(/\$(\d+)/g, (_, n: string) => {
    bindings.push(statement.values[Number(n) - 1]);
    return '?';
  });
  const result: { rows: T[] } = await db.raw(sql, bindings as Knex.RawBinding[]);
  return result.rows;
}
