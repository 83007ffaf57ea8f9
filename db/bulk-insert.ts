import { getTableColumns, getTableName, sql, type SQL } from "drizzle-orm";
import type { SQLiteColumn, SQLiteTable } from "drizzle-orm/sqlite-core";
import type { DbOrTx } from "./client";

/** Rows per statement: bounds the size of the one JSON text bound to each statement. */
const ROWS_PER_STATEMENT = 5000;

/**
 * Inserts many rows with one bound parameter per statement: the rows travel as one JSON array
 * and SQLite unpacks it with `json_each`. Binding tens of thousands of separate parameters costs
 * more than the insert itself; this keeps a large import close to the speed of a bare insert.
 *
 * Values go through each column's own driver mapping (timestamps, JSON, booleans), and columns
 * with a JavaScript default (ids, created/updated times) get it per row, exactly as Drizzle's
 * insert would. A column no row gives is left to its SQL default; a column with an SQL default
 * that some rows give and others leave out is refused (those rows would silently get null rather
 * than the default); any other column a row leaves out is null for that row.
 */
export async function insertMany<T extends SQLiteTable>(db: DbOrTx, table: T, rows: readonly T["$inferInsert"][]): Promise<void> {
  if (rows.length === 0) return;
  const columns = Object.entries(getTableColumns(table)) as [string, SQLiteColumn][];
  // Every column any row gives (not only the first row's), so no row's value is dropped.
  const given = new Set<string>();
  for (const row of rows) for (const [key, value] of Object.entries(row)) if (value !== undefined) given.add(key);
  const used = columns.filter(([key, column]) => given.has(key) || column.defaultFn !== undefined);
  for (const [at, row] of rows.entries()) {
    for (const [key, column] of used) {
      if ((row as Record<string, unknown>)[key] === undefined && column.defaultFn === undefined && column.hasDefault) {
        throw new Error(`insertMany into ${getTableName(table)}: row ${at} lacks ${key}, which another row gives`);
      }
    }
  }

  const packed = rows.map((row) =>
    used.map(([key, column]) => {
      const value = (row as Record<string, unknown>)[key] ?? (column.defaultFn ? column.defaultFn() : null);
      return value === null ? null : (column.mapToDriverValue(value) as unknown);
    }),
  );
  const names = sql.join(
    used.map(([, column]) => sql.identifier(column.name)),
    sql`, `,
  );
  const values: SQL = sql.join(
    used.map((_, index) => sql.raw(`json_extract(value, '$[${index}]')`)),
    sql`, `,
  );
  for (let start = 0; start < packed.length; start += ROWS_PER_STATEMENT) {
    const chunk = JSON.stringify(packed.slice(start, start + ROWS_PER_STATEMENT));
    await db.run(sql`insert into ${table} (${names}) select ${values} from json_each(${chunk})`);
  }
}
