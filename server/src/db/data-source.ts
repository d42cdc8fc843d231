import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities';
import { migrations } from './migrations';
import { pinSessionsToUtc } from './utc-session';

/** Schema changes go through migrations only: synchronize stays off everywhere, tests included. */
export function createDataSource(url: string, options: { socketPath?: string } = {}): DataSource {
  return pinSessionsToUtc(new DataSource({
    type: 'mariadb',
    url,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    timezone: 'Z',
    dateStrings: false,
    charset: 'utf8mb4_unicode_ci',
    extra: { connectionLimit: 20, ...(options.socketPath ? { socketPath: options.socketPath } : {}) },
    logging: ['error'],
  }));
}
