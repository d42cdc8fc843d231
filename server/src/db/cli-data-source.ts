// The TypeORM CLI wants a file with exactly one DataSource export.
import { createDataSource } from './data-source';

export default createDataSource(process.env.DATABASE_URL ?? 'mariadb://localhost/bumpboard');
