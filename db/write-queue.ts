import type { Client, InStatement, Transaction } from "@libsql/client";

/**
 * One writer at a time inside this process, for a local SQLite file.
 *
 * SQLite allows a single writer. The embedded libSQL driver waits for a busy lock synchronously,
 * which blocks the whole Node process — including the transaction that holds the lock — so two
 * overlapping write transactions in one server would freeze it until the busy timeout. Writes
 * therefore queue here (reads in WAL mode never wait for writers). Other processes still meet
 * SQLite's own lock and its busy timeout as usual.
 */
export class DatabaseBusyError extends Error {
  constructor() {
    super("The database stayed busy; nothing was changed. Try again in a moment.");
    this.name = "DatabaseBusyError";
  }
}

const WRITE = /^\s*(insert|update|delete|replace|create|drop|alter|with|pragma\s+\w+\s*=)/i;
const sqlOf = (stmt: InStatement | string | [string, unknown?]) =>
  typeof stmt === "string" ? stmt : Array.isArray(stmt) ? stmt[0] : stmt.sql;

export function serialiseWrites(client: Client, waitMs = 15_000): Client {
  let tail: Promise<void> = Promise.resolve();

  /** Waits for the writer's turn; returns the function that gives it up (callable once). */
  const acquire = (): Promise<() => void> => {
    let free!: () => void;
    const done = new Promise<void>((resolve) => (free = resolve));
    const previous = tail;
    tail = previous.then(() => done);
    let released = false;
    const release = () => {
      if (!released) {
        released = true;
        free();
      }
    };
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => {
        // Give our place up so the queue keeps moving, and say the database is busy.
        previous.then(release, release);
        reject(new DatabaseBusyError());
      }, waitMs);
      previous.then(() => {
        clearTimeout(timer);
        resolve(release);
      });
    });
  };

  const exclusive = async <T>(work: () => Promise<T>): Promise<T> => {
    const release = await acquire();
    try {
      return await work();
    } finally {
      release();
    }
  };

  const wrapTransaction = (tx: Transaction, release: () => void): Transaction =>
    new Proxy(tx, {
      get(target, prop, receiver) {
        if (prop === "commit" || prop === "rollback") {
          return async () => {
            try {
              return await (target[prop] as () => Promise<void>).call(target);
            } finally {
              release();
            }
          };
        }
        if (prop === "close") {
          return () => {
            try {
              target.close();
            } finally {
              release();
            }
          };
        }
        const value = Reflect.get(target, prop, receiver);
        return typeof value === "function" ? value.bind(target) : value;
      },
    });

  // Properties assigned on the client (tests wrap `execute` to count queries) live beside it,
  // so the queue's own calls still reach the real driver methods.
  const assigned = new Map<PropertyKey, unknown>();
  return new Proxy(client, {
    set(_target, prop, value) {
      assigned.set(prop, value);
      return true;
    },
    get(target, prop, receiver) {
      if (assigned.has(prop)) return assigned.get(prop);
      switch (prop) {
        case "execute":
          return (stmt: InStatement | string, args?: unknown) => {
            const run = () => (args === undefined ? target.execute(stmt as InStatement) : target.execute(stmt as string, args as never));
            return WRITE.test(sqlOf(stmt)) ? exclusive(run) : run();
          };
        case "batch":
          return (stmts: Parameters<Client["batch"]>[0], mode?: Parameters<Client["batch"]>[1]) => exclusive(() => target.batch(stmts, mode));
        case "migrate":
          return (stmts: InStatement[]) => exclusive(() => target.migrate(stmts));
        case "executeMultiple":
          return (sql: string) => exclusive(() => target.executeMultiple(sql));
        case "transaction":
          return async (mode?: "write" | "read" | "deferred") => {
            if (mode === "read") return target.transaction(mode);
            const release = await acquire();
            try {
              return wrapTransaction(await target.transaction(mode), release);
            } catch (error) {
              release();
              throw error;
            }
          };
        default: {
          const value = Reflect.get(target, prop, receiver);
          return typeof value === "function" ? value.bind(target) : value;
        }
      }
    },
  });
}
