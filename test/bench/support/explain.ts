/**
 * The plans of the SQL a service function really runs: the statements are
 * captured from Knex's 'query' event while the function runs (so nothing is
 * rewritten: the same query builders, the same bindings), then each is run
 * again under EXPLAIN (ANALYZE, BUFFERS, FORMAT JSON) through pg, which takes
 * the positional parameters Knex sent.
 */
import type { Knex } from 'knex';
import pg from 'pg';

export interface CapturedQuery {
  sql: string;
  bindings: unknown[];
}

/** Runs fn and returns what it returned with every statement it sent through db (use a Knex instance no one else is using meanwhile). */
export async function captureQueries<T>(db: Knex, fn: () => Promise<T>): Promise<{ result: T; queries: CapturedQuery[] }> {
  const queries: CapturedQuery[] = [];
  const listener = (q: { sql: string; bindings?: unknown[] }) => queries.push({ sql: q.sql, bindings: q.bindings ?? [] });
  db.on('query', listener);
  try {
    return { result: await fn(), queries };
  } finally {
    db.off('query', listener);
  }
}

interface PlanNode {
  'Node Type': string;
  'Relation Name'?: string;
  'Index Name'?: string;
  'Actual Rows'?: number;
  Plans?: PlanNode[];
}

export interface ExplainedQuery {
  sql: string;
  executionMs: number;
  /** Scan nodes: `Seq Scan specimens`, `Index Only Scan specimens_data_group_idx`, ... */
  scans: string[];
  /** Seq Scan nodes on the given table. */
  seqScans: number;
}

function planNodes(node: PlanNode): PlanNode[] {
  return [node, ...(node.Plans ?? []).flatMap(planNodes)];
}

/** EXPLAIN ANALYZE of each captured statement that reads `table`; the scans of its plan and its Seq Scans of `table`. */
export async function explainQueries(connection: pg.ClientConfig, queries: CapturedQuery[], table: string): Promise<ExplainedQuery[]> {
  const client = new pg.Client(connection);
  await client.connect();
  try {
    const explained: ExplainedQuery[] = [];
    for (const q of queries.filter((query) => new RegExp(`\\b${table}\\b`).test(query.sql))) {
      const result = await client.query(`explain (analyze, buffers, format json) ${q.sql}`, q.bindings);
      const [plan] = result.rows[0]['QUERY PLAN'] as Array<{ Plan: PlanNode; 'Execution Time': number }>;
      const nodes = planNodes(plan.Plan).filter((n) => /Scan/.test(n['Node Type']));
      explained.push({
        sql: q.sql,
        executionMs: plan['Execution Time'],
        scans: nodes.map((n) => `${n['Node Type']} ${n['Index Name'] ?? n['Relation Name'] ?? ''}`.trim()),
        seqScans: nodes.filter((n) => n['Node Type'] === 'Seq Scan' && n['Relation Name'] === table).length,
      });
    }
    return explained;
  } finally {
    await client.end();
  }
}
