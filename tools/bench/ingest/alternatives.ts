/**
 * Other ways to count a column, measured beside ours: csv-parse (the streaming parser the API used
 * before) and DuckDB's CSV reader (`@duckdb/node-api`, two threads).
 */
import { createReadStream } from 'node:fs';
import { parse } from 'csv-parse';

/** csv-parse with the options the API used, counting into a Map. Answers the rows counted. */
export async function countWithCsvParse(path: string, column: string): Promise<number> {
  const parser = createReadStream(path, { highWaterMark: 256 * 1024 }).pipe(
    parse({ bom: true, skip_empty_lines: true, skip_records_with_empty_values: true, relax_column_count: true }),
  );
  const counts = new Map<string, number>();
  let index = -1;
  let total = 0;
  for await (const record of parser as AsyncIterable<string[]>) {
    if (index === -1) {
      index = record.indexOf(column);
      continue;
    }
    const label = record[index].trim();
    counts.set(label, (counts.get(label) ?? 0) + 1);
    total++;
  }
  return total;
}

/** DuckDB's read_csv with a GROUP BY, limited to two threads as the product's machine has. */
export async function countWithDuckDb(path: string, column: string): Promise<number> {
  // Loaded only here, so the other measurements do not carry DuckDB's native library in their memory.
  // A plain require resolves through NODE_PATH from the bundle.
  const { DuckDBInstance } = require('@duckdb/node-api') as typeof import('@duckdb/node-api');
  const instance = await DuckDBInstance.create(':memory:', { threads: '2' });
  const connection = await instance.connect();
  const quoted = `'${path.replace(/'/g, "''")}'`;
  const reader = await connection.runAndReadAll(`SELECT "${column}" AS label, count(*) AS n FROM read_csv(${quoted}, header = true) GROUP BY 1`);
  const total = reader.getRowObjects().reduce((sum, row) => sum + Number(row['n']), 0);
  connection.closeSync();
  instance.closeSync();
  return total;
}
