import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A version per flight's stored figures: it rises by one on every write, travels in each notice and is the ETag of
 * the desk's reads, so a console can tell a missed notice (a gap) from the next one.
 */
export class ForecastVersion1796270000000 implements MigrationInterface {
  name = 'ForecastVersion1796270000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `flight_forecasts` ADD `version` int UNSIGNED NOT NULL DEFAULT 0');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `flight_forecasts` DROP COLUMN `version`');
  }
}
