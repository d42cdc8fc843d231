import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Refunds the rules add to a denied passenger's compensation (optional fees, a downgrade), each paid by its own payment row. */
export class RuleRefunds1796401000000 implements MigrationInterface {
  name = 'RuleRefunds1796401000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      'CREATE TABLE `rule_refunds` (`id` int NOT NULL AUTO_INCREMENT, `station_id` int NOT NULL, `flight_id` int NOT NULL, `passenger_id` int NOT NULL, ' +
        '`base_compensation_id` int NOT NULL, `payment_compensation_id` int NOT NULL, `cabin_change_id` int NULL, `kind` varchar(16) NOT NULL, ' +
        '`amount_minor` int NOT NULL, `currency` char(3) NOT NULL, `rule_ref` varchar(200) NOT NULL, `lines` json NOT NULL, ' +
        '`created_at` datetime(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3), ' +
        'UNIQUE INDEX `uq_rule_refund_payment` (`payment_compensation_id`), INDEX `ix_rule_refund_flight` (`flight_id`), PRIMARY KEY (`id`), ' +
        'CONSTRAINT `fk_rule_refund_station` FOREIGN KEY (`station_id`) REFERENCES `stations`(`id`) ON DELETE NO ACTION ON UPDATE NO ACTION, ' +
        'CONSTRAINT `fk_rule_refund_flight` FOREIGN KEY (`flight_id`) REFERENCES `flights`(`id`) ON DELETE RESTRICT ON UPDATE NO ACTION, ' +
        'CONSTRAINT `fk_rule_refund_passenger` FOREIGN KEY (`passenger_id`) REFERENCES `passengers`(`id`) ON DELETE RESTRICT ON UPDATE NO ACTION, ' +
        'CONSTRAINT `fk_rule_refund_base` FOREIGN KEY (`base_compensation_id`) REFERENCES `compensations`(`id`) ON DELETE RESTRICT ON UPDATE NO ACTION, ' +
        'CONSTRAINT `fk_rule_refund_payment` FOREIGN KEY (`payment_compensation_id`) REFERENCES `compensations`(`id`) ON DELETE RESTRICT ON UPDATE NO ACTION, ' +
        'CONSTRAINT `fk_rule_refund_cabin_change` FOREIGN KEY (`cabin_change_id`) REFERENCES `cabin_changes`(`id`) ON DELETE RESTRICT ON UPDATE NO ACTION) ENGINE=InnoDB',
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE `rule_refunds`');
  }
}
