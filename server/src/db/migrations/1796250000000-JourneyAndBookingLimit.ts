import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each booking carries its onward flights to the final destination (the rules measure the journey, not the leg), and
 * each station a ceiling on bookings per flight: capacity times this factor, in basis points (15000 = 1.5 x).
 */
export class JourneyAndBookingLimit1796250000000 implements MigrationInterface {
  name = 'JourneyAndBookingLimit1796250000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `bookings` ADD `itinerary` json NULL');
    await q.query("ALTER TABLE `stations` ADD `max_overbooking_bp` int NOT NULL DEFAULT '15000'");
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('ALTER TABLE `stations` DROP COLUMN `max_overbooking_bp`');
    await q.query('ALTER TABLE `bookings` DROP COLUMN `itinerary`');
  }
}
