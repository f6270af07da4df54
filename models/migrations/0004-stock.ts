import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/** Storage locations, lots, the movement ledger, purchase requests and low-stock episodes. */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`CREATE TABLE storage_location (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    code VARCHAR(16) NOT NULL,
    name VARCHAR(120) NOT NULL,
    created_at DATETIME(3) NOT NULL,
    UNIQUE KEY storage_location_site_code (site_id, code),
    CONSTRAINT storage_location_site_fk FOREIGN KEY (site_id) REFERENCES site (id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE stock_lot (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    grease_id INT UNSIGNED NOT NULL,
    pack_id INT UNSIGNED NOT NULL,
    location_id INT UNSIGNED NOT NULL,
    lot_number VARCHAR(60) NOT NULL,
    label_code CHAR(8) NOT NULL,
    manufactured_on DATE NULL,
    expires_on DATE NULL,
    expiry_source ENUM('label','shelf_life_from_manufacture','shelf_life_from_receipt','unknown') NOT NULL DEFAULT 'unknown',
    received_on DATE NOT NULL,
    on_hand INT NOT NULL DEFAULT 0,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY stock_lot_label (label_code),
    KEY stock_lot_pick (site_id, grease_id, pack_id, expires_on),
    CONSTRAINT stock_lot_site_fk FOREIGN KEY (site_id) REFERENCES site (id),
    CONSTRAINT stock_lot_grease_fk FOREIGN KEY (grease_id) REFERENCES grease (id),
    CONSTRAINT stock_lot_pack_fk FOREIGN KEY (pack_id) REFERENCES grease_pack (id),
    CONSTRAINT stock_lot_location_fk FOREIGN KEY (location_id) REFERENCES storage_location (id),
    CONSTRAINT stock_lot_on_hand_not_negative CHECK (on_hand >= 0)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE stock_movement (
    id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    lot_id INT UNSIGNED NOT NULL,
    kind ENUM('receipt','issue','return','transfer_in','transfer_out','count_adjustment','scrap') NOT NULL,
    quantity INT NOT NULL,
    reason VARCHAR(300) NULL,
    point_id INT UNSIGNED NULL,
    user_id VARCHAR(36) NOT NULL,
    idempotency_key VARCHAR(255) NULL,
    created_at DATETIME(3) NOT NULL,
    KEY stock_movement_lot (lot_id, created_at),
    KEY stock_movement_site_time (site_id, created_at),
    CONSTRAINT stock_movement_lot_fk FOREIGN KEY (lot_id) REFERENCES stock_lot (id),
    CONSTRAINT stock_movement_not_zero CHECK (quantity <> 0)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE stock_policy (
    site_id INT UNSIGNED NOT NULL,
    grease_id INT UNSIGNED NOT NULL,
    reorder_point_grams DECIMAL(12,2) NULL,
    safety_stock_weeks DECIMAL(5,1) NULL,
    updated_at DATETIME(3) NOT NULL,
    PRIMARY KEY (site_id, grease_id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE low_stock_episode (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    grease_id INT UNSIGNED NOT NULL,
    started_at DATETIME(3) NOT NULL,
    ended_at DATETIME(3) NULL,
    open_key VARCHAR(40) NULL,
    UNIQUE KEY low_stock_episode_open (open_key),
    KEY low_stock_episode_grease (site_id, grease_id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE purchase_request (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    grease_id INT UNSIGNED NOT NULL,
    pack_id INT UNSIGNED NOT NULL,
    packs INT UNSIGNED NOT NULL,
    state ENUM('requested','ordered','received','cancelled') NOT NULL DEFAULT 'requested',
    episode_id INT UNSIGNED NULL,
    note VARCHAR(300) NULL,
    created_by VARCHAR(36) NULL,
    created_at DATETIME(3) NOT NULL,
    ordered_at DATETIME(3) NULL,
    received_at DATETIME(3) NULL,
    KEY purchase_request_state (site_id, state),
    CONSTRAINT purchase_request_grease_fk FOREIGN KEY (grease_id) REFERENCES grease (id),
    CONSTRAINT purchase_request_pack_fk FOREIGN KEY (pack_id) REFERENCES grease_pack (id),
    CONSTRAINT purchase_request_packs_positive CHECK (packs > 0)
  ) ENGINE=InnoDB`);
};

export const down: Migration = async ({ context: sequelize }) => {
  for (const table of ["purchase_request", "low_stock_episode", "stock_policy", "stock_movement", "stock_lot", "storage_location"]) {
    await sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
};
