import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/**
 * An audit entry is appended by one call: the procedure locks the chain head, finishes the entry's hash from the
 * template the app sends (SHA-256 over the canonical JSON, FIPS 180-4 via SHA2(…, 256)) and inserts it; the
 * trigger of 0008 still refuses an entry that does not follow the head and moves the head. Before, the app read
 * the head, hashed, then inserted: the head — one lock shared by every audited write — stayed locked across two
 * trips through the app instead of one. It runs with its definer's rights; the app needs only EXECUTE.
 */
export const up: Migration = async ({ context: sequelize }) => {
  await sequelize.query(`CREATE PROCEDURE audit_append(
      IN p_at DATETIME(3),
      IN p_actor_id VARCHAR(36),
      IN p_site_id INT UNSIGNED,
      IN p_event VARCHAR(60),
      IN p_subject_type VARCHAR(40),
      IN p_subject_id VARCHAR(64),
      IN p_payload_json MEDIUMTEXT CHARACTER SET utf8mb4,
      IN p_hash_before MEDIUMTEXT CHARACTER SET utf8mb4,
      IN p_hash_after MEDIUMTEXT CHARACTER SET utf8mb4)
    MODIFIES SQL DATA
    BEGIN
      DECLARE head_seq BIGINT UNSIGNED;
      DECLARE head_hash CHAR(64);
      DECLARE new_hash CHAR(64);
      SELECT seq, hash INTO head_seq, head_hash FROM audit_head WHERE id = 1 FOR UPDATE;
      SET new_hash = SHA2(CONCAT(p_hash_before, head_hash, '","seq":', head_seq + 1, p_hash_after), 256);
      INSERT INTO audit_log (seq, at, actor_id, site_id, event, subject_type, subject_id, payload_json, prev_hash, hash)
        VALUES (head_seq + 1, p_at, p_actor_id, p_site_id, p_event, p_subject_type, p_subject_id, p_payload_json, head_hash, new_hash);
      SELECT head_seq + 1 AS seq, new_hash AS hash;
    END`);
};

export const down: Migration = async ({ context: sequelize }) => {
  await sequelize.query("DROP PROCEDURE IF EXISTS audit_append");
};
