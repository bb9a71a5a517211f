import { createRequire } from 'node:module';

/**
 * Counts the SQL statements this process sends (benchmarks only): every mysql2 connection's `query` and
 * `execute`, pooled or not, by its first keyword. Installed once; it wraps the driver's own prototype methods.
 */
export interface QueryCounts {
  total: number;
  byKeyword: Record<string, number>;
}

const counts: QueryCounts = { total: 0, byKeyword: {} };
let installed = false;

function keywordOf(statement: unknown): string {
  const text = typeof statement === 'string' ? statement : (statement as { sql?: string } | null)?.sql ?? '';
  return (/^\s*(\w+)/.exec(text)?.[1] ?? '?').toLowerCase();
}

export function installQueryCounter(): QueryCounts {
  if (installed) return counts;
  installed = true;
  const logStatements = process.env.BENCH_LOG_QUERIES === '1';
  const require = createRequire(import.meta.url);
  const mysql = require('mysql2') as { Connection: { prototype: object } };
  const base = Object.getPrototypeOf(mysql.Connection.prototype) as Record<'query' | 'execute', (...args: unknown[]) => unknown>;
  for (const method of ['query', 'execute'] as const) {
    const original = base[method];
    base[method] = function counted(this: unknown, ...args: unknown[]) {
      const keyword = keywordOf(args[0]);
      if (logStatements) {
        const text = typeof args[0] === 'string' ? args[0] : (args[0] as { sql?: string }).sql ?? '';
        const values = Array.isArray(args[1]) ? (args[1] as unknown[]) : [];
        const valueChars = values.reduce<number>((sum, value) => sum + (typeof value === 'string' ? value.length : 8), 0);
        process.stderr.write(`sql [${text.length} + ${valueChars} chars of values] ${text.slice(0, 160).replace(/\s+/g, ' ')}\n`);
      }
      counts.total += 1;
      counts.byKeyword[keyword] = (counts.byKeyword[keyword] ?? 0) + 1;
      return original.apply(this, args);
    };
  }
  return counts;
}
