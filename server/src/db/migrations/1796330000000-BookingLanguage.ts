import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The language the booking's passengers read (en, fr, es, de, it), from the feed or the manifest. Null for
 * existing bookings: their notices pick the browser's language on the passenger page and English in mail.
 */
export class BookingLanguage1796330000000 implements MigrationInterface {
  name = 'BookingLanguage1796330000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `bookings` ADD `language` varchar(5) NULL');
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `bookings` DROP COLUMN `language`');
  }
}
