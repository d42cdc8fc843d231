// express-mysql-session ships no types; this covers the part we use.
declare module 'express-mysql-session' {
  import type { Store } from 'express-session';
  interface Options {
    createDatabaseTable?: boolean;
    clearExpired?: boolean;
    checkExpirationInterval?: number;
    schema?: { tableName: string; columnNames: { session_id: string; expires: string; data: string } };
  }
  interface MySQLStoreClass {
    new (options: Options, connection?: unknown): Store & { close(): Promise<void> };
  }
  function factory(session: unknown): MySQLStoreClass;
  export default factory;
}
