import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Where the booking was made (web, app, agency, corporate), from the feed or the manifest; show rates are learned
 * per channel. Null for existing bookings and for sources that do not say: their outcomes are kept as 'unknown'.
 */
export class BookingChannel1796800000000 implements MigrationInterface {
  name = 'BookingChannel1796800000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `bookings` ADD `channel` varchar(16) NULL');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `bookings` DROP COLUMN `channel`');
  }
}
