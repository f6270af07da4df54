import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/**
 * The audit trail: an append-only table whose every row carries the SHA-256 of the row before it, and the head
 * of the chain (one row) that appends lock to stay in order. The app's database account may only read and
 * insert audit rows (grants, set by the start and test scripts); these triggers refuse changes from anyone.
 */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`CREATE TABLE audit_log (
    seq BIGINT UNSIGNED NOT NULL PRIMARY KEY,
    at DATETIME(3) NOT NULL,
    actor_id VARCHAR(36) NULL,
    site_id INT UNSIGNED NULL,
    event VARCHAR(60) NOT NULL,
    subject_type VARCHAR(40) NULL,
    subject_id VARCHAR(64) NULL,
    payload_json MEDIUMTEXT NOT NULL,
    prev_hash CHAR(64) NOT NULL,
    hash CHAR(64) NOT NULL,
    KEY audit_log_at (at),
    KEY audit_log_subject (subject_type, subject_id),
    KEY audit_log_site_at (site_id, at)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE audit_head (
    id TINYINT UNSIGNED NOT NULL PRIMARY KEY,
    seq BIGINT UNSIGNED NOT NULL,
    hash CHAR(64) NOT NULL,
    CONSTRAINT audit_head_single CHECK (id = 1)
  ) ENGINE=InnoDB`);
  await q(`INSERT INTO audit_head (id, seq, hash) VALUES (1, 0, '${"0".repeat(64)}')`);
  await q(`CREATE TRIGGER audit_log_no_update BEFORE UPDATE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit trail is append-only: add a correcting entry instead.'`);
  await q(`CREATE TRIGGER audit_log_no_delete BEFORE DELETE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit trail is append-only: rows cannot be deleted.'`);
  await q(`CREATE TRIGGER audit_head_no_delete BEFORE DELETE ON audit_head FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'The audit chain head cannot be deleted.'`);
};

export const down: Migration = async ({ context: sequelize }) => {
  for (const trigger of ["audit_head_no_delete", "audit_log_no_delete", "audit_log_no_update"])
    await sequelize.query(`DROP TRIGGER IF EXISTS ${trigger}`);
  await sequelize.query("DROP TABLE IF EXISTS audit_head");
  await sequelize.query("DROP TABLE IF EXISTS audit_log");
};
