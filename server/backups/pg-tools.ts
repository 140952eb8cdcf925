import { execFile } from 'node:child_process';
import path from 'node:path';

/**
 * Runs one of PostgreSQL's client programs against the database in `databaseUrl`. The password goes in PGPASSWORD,
 * never on the command line (where `ps` would show it).
 */
export function runPgTool(pgBin: string, tool: 'pg_dump' | 'pg_restore', databaseUrl: string, args: string[]): Promise<string> {
  const url = new URL(databaseUrl);
  const connection = ['--host', url.hostname, '--port', url.port || '5432', '--username', decodeURIComponent(url.username || 'postgres')];
  const env = { ...process.env, PGPASSWORD: decodeURIComponent(url.password), PGDATABASE: databaseName(databaseUrl), PGCONNECT_TIMEOUT: '10' };
  return new Promise((resolve, reject) =>
    execFile(path.join(pgBin, tool), [...connection, ...args], { env, maxBuffer: 64 * 1024 * 1024 }, (err, stdout, stderr) =>
      err ? reject(new Error(`${tool} failed: ${stderr.trim() || err.message}`)) : resolve(stdout),
    ),
  );
}

export const databaseName = (databaseUrl: string) => decodeURIComponent(new URL(databaseUrl).pathname.slice(1));

/** The same server, another database. */
export function withDatabase(databaseUrl: string, name: string): string {
  const url = new URL(databaseUrl);
  url.pathname = `/${encodeURIComponent(name)}`;
  return url.toString();
}
