import "server-only";
import { Transaction, type Sequelize } from "sequelize";
import { getSequelize, statementCounter } from "./db";

/**
 * Several statements sent to MariaDB as ONE compound statement (`BEGIN NOT ATOMIC … END`), so a request pays one
 * network round trip for all of them instead of one each; the rows of the SELECTs among them come back in order. On
 * this kind of machine a round trip costs more than a simple statement (a socket write and a wake-up on both sides),
 * which is what held the stock issue back.
 *
 * The statements run in order and the first failure stops the rest; a statement may require that it changed
 * exactly `expectChanged` rows, otherwise the block stops with `BatchCheckFailed` naming it. Values go in as `?`
 * placeholders and are escaped by the driver (an array becomes a list, as in `IN (?)`); the SQL text itself must be
 * fixed by the caller.
 *
 * The block goes straight to the driver, on the ORM's connection (the transaction's, or one from the ORM's pool),
 * not through `sequelize.query`: for a statement whose rows are used as the driver gives them, the ORM's layer
 * (the replacements parsed out of the SQL and escaped, dates formatted, a stack trace taken, the result wrapped)
 * cost the app's one thread more than the driver did. The connection, its settings and the errors are the ORM's own.
 */
export interface BatchStatement {
  sql: string;
  params: unknown[];
  /** The rows the statement must change (ROW_COUNT()); anything else stops the batch. */
  expectChanged?: number;
}

/** SQLSTATE and error number a failed row-count check signals (45000 is the "user-defined exception" class). */
const CHECK_STATE = "45000";
const CHECK_ERRNO = 45_101;

export class BatchCheckFailed extends Error {
  constructor(readonly index: number) {
    super(`Statement ${index} of a batch did not change the expected number of rows.`);
    this.name = "BatchCheckFailed";
  }
}

/**
 * How a block stands to the transaction: "own" begins and commits one of its own (any error rolls it back and is
 * raised again unchanged); "inside" runs in the caller's; "commit" runs in the caller's and commits it as its last
 * statement (a failure stops the block before the COMMIT, and the caller rolls back).
 */
export type BlockMode = "own" | "inside" | "commit";

/** The compound statement's text and its values, in order. */
export function compoundStatement(statements: BatchStatement[], mode: BlockMode): { sql: string; params: unknown[] } {
  if (!statements.length) throw new Error("An empty batch.");
  const parts: string[] = ["BEGIN NOT ATOMIC"];
  if (mode === "own") parts.push("DECLARE EXIT HANDLER FOR SQLEXCEPTION BEGIN ROLLBACK; RESIGNAL; END;", "START TRANSACTION;");
  const params: unknown[] = [];
  statements.forEach((s, i) => {
    if (/;\s*$/.test(s.sql)) throw new Error("A batch statement must not end with a semicolon.");
    parts.push(`${s.sql};`);
    params.push(...s.params);
    if (s.expectChanged !== undefined)
      parts.push(
        `IF ROW_COUNT() <> ${Number(s.expectChanged)} THEN SIGNAL SQLSTATE '${CHECK_STATE}' SET MYSQL_ERRNO = ${CHECK_ERRNO}, MESSAGE_TEXT = 'batch check ${i}'; END IF;`,
      );
  });
  if (mode !== "inside") parts.push("COMMIT;");
  parts.push("END");
  return { sql: parts.join("\n"), params };
}

const checkIndex = (error: unknown): number | null => {
  const e = error as { original?: { errno?: number; sqlMessage?: string; text?: string }; parent?: { errno?: number } };
  const original = e.original ?? e.parent;
  if (original?.errno !== CHECK_ERRNO) return null;
  const text = String((original as { sqlMessage?: string }).sqlMessage ?? (original as { text?: string }).text ?? (error as Error).message);
  const found = /batch check (\d+)/.exec(text);
  return found ? Number(found[1]) : -1;
};

type DriverConnection = { query(sql: string, values?: unknown[]): Promise<unknown> };
type ConnectionManager = {
  getConnection(options: object): Promise<DriverConnection>;
  releaseConnection(connection: DriverConnection): void | Promise<void>;
};
type DialectQuery = new (connection: DriverConnection, sequelize: Sequelize, options: object) => {
  formatError(error: unknown): Error;
};

/**
 * One statement on the driver: in the transaction's connection, or on a connection of the ORM's pool given back
 * afterwards. Counted like the ORM's statements (`statementCounter`); a failure becomes the error the ORM would raise
 * for it (UniqueConstraintError, DatabaseError…, with the driver's error as `original`).
 */
async function onDriver(sql: string, params: unknown[], transaction?: Transaction): Promise<unknown> {
  const sequelize = getSequelize();
  const manager = sequelize.connectionManager as unknown as ConnectionManager;
  const state = transaction as unknown as { finished?: string; connection?: DriverConnection } | undefined;
  if (state?.finished) throw new Error(`The transaction has already ended (${state.finished}); it cannot be used.`);
  const connection = state ? state.connection : await manager.getConnection({});
  if (!connection) throw new Error("The transaction has no connection.");
  statementCounter.count += 1;
  try {
    return await connection.query(sql, params);
  } catch (error) {
    const Query = (sequelize as unknown as { dialect: { Query: DialectQuery } }).dialect.Query;
    throw new Query(connection, sequelize, {}).formatError(error);
  } finally {
    if (!state) await manager.releaseConnection(connection);
  }
}

/** Sends the statements; answers the driver's result: one statement's own, or a block's list of result sets. */
async function send(statements: BatchStatement[], mode: BlockMode, transaction?: Transaction): Promise<{ single: boolean; data: unknown }> {
  // One plain statement needs no block around it.
  const single = mode === "inside" && statements.length === 1 && statements[0]!.expectChanged === undefined;
  const { sql, params } = single ? statements[0]! : compoundStatement(statements, mode);
  try {
    return { single, data: await onDriver(sql, params, transaction) };
  } catch (error) {
    const index = checkIndex(error);
    if (index !== null) throw new BatchCheckFailed(index);
    throw error;
  }
}

/** The rows of each SELECT, in order (the driver answers a block with one result set per SELECT, then a status). */
function resultSets({ single, data }: { single: boolean; data: unknown }): unknown[][] {
  if (single) return Array.isArray(data) ? [data] : [];
  return Array.isArray(data) ? data.filter((part): part is unknown[] => Array.isArray(part)) : [];
}

/**
 * Reads (and writes) sent as one compound statement in the caller's transaction, or on their own without one;
 * answers each SELECT's rows, in order. A read that locks (`FOR UPDATE`) locks as it would alone.
 */
export async function queryBlock(statements: BatchStatement[], transaction?: Transaction): Promise<unknown[][]> {
  return resultSets(await send(statements, "inside", transaction));
}

/** Runs the statements inside the caller's transaction (which commits or rolls back as usual). */
export async function batchInTransaction(statements: BatchStatement[], transaction: Transaction): Promise<void> {
  await send(statements, "inside", transaction);
}

/**
 * Runs the statements as a transaction of their own, begun and committed inside the block: one round trip in all.
 * On any error nothing of it stays.
 */
export async function batchAtomically(statements: BatchStatement[]): Promise<void> {
  await send(statements, "own");
}

/**
 * `sequelize.transaction(work)`, except that the work ends the transaction itself with `commitWith(last writes)`:
 * its last writes and the COMMIT go out as one compound statement. Locks taken by those writes (the audit chain head
 * above all, which every audited write waits for) are then held only while the server commits, not across another
 * round trip to this process and back. If the work returns without calling it, the transaction commits as usual; if
 * it throws, or the block fails, it rolls back.
 *
 * The START TRANSACTION goes out at once with the `opening` statements, in one compound statement that is not waited
 * for: the work gets its SELECTs' rows as `opened`, and any statement the work sends meanwhile follows it on the same
 * connection (the driver pipelines; the server runs them in order). A write must not be sent before `opened` has
 * settled without error (a failed START or opening statement would leave it to run on its own).
 */
export async function transactionCommittedByBatch<T>(
  opening: BatchStatement[],
  work: (
    transaction: Transaction,
    commitWith: (statements: BatchStatement[]) => Promise<void>,
    opened: Promise<unknown[][]>,
  ) => Promise<T>,
): Promise<T> {
  const { transaction, opened } = await beginPipelined(opening);
  const state = transaction as unknown as { finished?: string; cleanup(): void };
  const commitWith = async (statements: BatchStatement[]) => {
    await opened;
    if (statements.length) await send(statements, "commit", transaction);
    else await getSequelize().query("COMMIT", { transaction });
    // Committed by the block: Sequelize is told so, and the connection goes back to the pool as after its own commit.
    state.finished = "commit";
    state.cleanup();
  };
  try {
    const result = await work(transaction, commitWith, opened);
    await opened;
    if (!state.finished) await transaction.commit();
    return result;
  } catch (error) {
    // A deadlock has already been rolled back by Sequelize (and the transaction marked finished).
    if (!state.finished) await transaction.rollback().catch(() => {});
    throw error;
  }
}

/** A Sequelize transaction whose START TRANSACTION (with `opening`) is sent but not waited for; see above. */
async function beginPipelined(opening: BatchStatement[]): Promise<{ transaction: Transaction; opened: Promise<unknown[][]> }> {
  const sequelize = getSequelize();
  const transaction = new Transaction(sequelize, {});
  // What Sequelize's own begin does before sending START TRANSACTION (Transaction.prepareEnvironment).
  const internal = transaction as unknown as { id: string; connection: { uuid?: string } };
  const manager = sequelize.connectionManager as unknown as { getConnection(o: { uuid: string }): Promise<{ uuid?: string }> };
  const connection = await manager.getConnection({ uuid: internal.id });
  internal.connection = connection;
  connection.uuid = internal.id;
  const opened = opening.length
    ? send([{ sql: "START TRANSACTION", params: [] }, ...opening], "inside", transaction).then(resultSets)
    : sequelize.query("START TRANSACTION", { transaction }).then(() => []);
  opened.catch(() => {}); // awaited by whoever writes
  return { transaction, opened };
}
