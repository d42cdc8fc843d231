// Types for mariadb.mjs (a plain Node script, run before dependencies exist), for the tests that start their own.
export interface PrivateMariadb {
  url: string;
  socket: string;
  resetDatabase(): void;
  stop(): Promise<void>;
}
export function ensureMariadbInstalled(): void;
export function startPrivateMariadb(options: { baseDir: string; port: number }): Promise<PrivateMariadb>;
