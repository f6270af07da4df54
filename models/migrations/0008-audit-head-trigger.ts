import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/**
 * The audit chain head now moves only through an append: a trigger checks that a new entry follows the head (next
 * sequence number, previous hash equal to the head's hash) and moves the head to it, in the same statement. An
 * append is one locking read and one insert (it was three statements), so the head — one lock shared by every
 * audited write — is held for less time; and the app's account no longer needs to change the head at all.
 */
export const up: Migration = async ({ context: sequelize }) => {
  await sequelize.query(`CREATE TRIGGER audit_log_follows_head BEFORE INSERT ON audit_log FOR EACH ROW
    BEGIN
      DECLARE head_seq BIGINT UNSIGNED;
      DECLARE head_hash CHAR(64);
      -- A locking read: a plain one would see the transaction's snapshot, not the head as it is now.
      SELECT seq, hash INTO head_seq, head_hash FROM audit_head WHERE id = 1 FOR UPDATE;
      IF NEW.seq <> head_seq + 1 OR NEW.prev_hash <> head_hash THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'An audit entry must follow the chain head.';
      END IF;
      UPDATE audit_head SET seq = NEW.seq, hash = NEW.hash WHERE id = 1;
    END`);
};

export const down: Migration = async ({ context: sequelize }) => {
  await sequelize.query("DROP TRIGGER IF EXISTS audit_log_follows_head");
};
