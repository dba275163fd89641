import type { Database } from "./connection";

/*
 * What every query takes as its first argument: the database or an open transaction. The web
 * server passes its pooled client (db/client.ts), the lab-run worker and the seed their own, and a
 * query that must commit with another passes the transaction, so all of them share one set of
 * queries.
 */

export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Executor = Database | Tx;
