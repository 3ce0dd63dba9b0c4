// Multi-row inserts in fixed-size chunks: one statement per chunk keeps bulk loads fast while
// staying far below PostgreSQL's 65,535 bind parameters per statement.

export const INSERT_CHUNK_ROWS = 1000;

export async function insertInChunks<Row, Returned>(
  rows: readonly Row[],
  insert: (chunk: Row[]) => Promise<Returned[]>,
  chunkRows = INSERT_CHUNK_ROWS,
): Promise<Returned[]> {
  const out: Returned[] = [];
  for (let i = 0; i < rows.length; i += chunkRows) {
    out.push(...(await insert(rows.slice(i, i + chunkRows))));
  }
  return out;
}
