import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/**
 * The storeroom's daily work: a label identifies a received lot wherever its containers stand, so a transfer
 * puts the same label code at a second location; movements name who got an issue and the other location of a
 * transfer; a receipt keeps its delivery note; a service records the lot it came from; purchase requests carry
 * the order reference.
 */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`ALTER TABLE stock_lot
    DROP INDEX stock_lot_label,
    ADD UNIQUE KEY stock_lot_label_location (label_code, location_id),
    ADD COLUMN delivery_document_id INT UNSIGNED NULL AFTER received_on,
    ADD COLUMN purchase_request_id INT UNSIGNED NULL AFTER delivery_document_id,
    ADD KEY stock_lot_location (location_id, grease_id)`);
  await q(`ALTER TABLE stock_movement
    ADD COLUMN issued_to_user_id VARCHAR(36) NULL AFTER point_id,
    ADD COLUMN other_location_id INT UNSIGNED NULL AFTER issued_to_user_id,
    ADD KEY stock_movement_site_kind_time (site_id, kind, created_at)`);
  await q(`ALTER TABLE service_record ADD COLUMN lot_id INT UNSIGNED NULL AFTER grease_id`);
  await q(`ALTER TABLE purchase_request
    ADD COLUMN reference VARCHAR(60) NULL AFTER note,
    ADD COLUMN cancelled_at DATETIME(3) NULL AFTER received_at`);
  // The demand forecast reads the points of one grease at one site.
  await q(`ALTER TABLE lube_point ADD KEY lube_point_site_assigned (site_id, assigned_grease_id)`);
};

export const down: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q("ALTER TABLE lube_point DROP INDEX lube_point_site_assigned");
  await q("ALTER TABLE purchase_request DROP COLUMN reference, DROP COLUMN cancelled_at");
  await q("ALTER TABLE service_record DROP COLUMN lot_id");
  await q("ALTER TABLE stock_movement DROP INDEX stock_movement_site_kind_time, DROP COLUMN issued_to_user_id, DROP COLUMN other_location_id");
  await q(`ALTER TABLE stock_lot DROP INDEX stock_lot_location, DROP COLUMN delivery_document_id, DROP COLUMN purchase_request_id,
    DROP INDEX stock_lot_label_location, ADD UNIQUE KEY stock_lot_label (label_code)`);
};
