import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/** Users, sessions, sites, site access, the mail outbox, sign-in throttling and invitations. */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`CREATE TABLE site (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    code VARCHAR(16) NOT NULL,
    name VARCHAR(120) NOT NULL,
    timezone VARCHAR(64) NOT NULL DEFAULT 'UTC',
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY site_code_unique (code)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE app_user (
    id VARCHAR(36) NOT NULL PRIMARY KEY,
    email VARCHAR(254) NOT NULL,
    name VARCHAR(120) NOT NULL,
    role ENUM('admin','lead','clerk','technician','auditor') NOT NULL,
    status ENUM('invited','active','disabled') NOT NULL DEFAULT 'active',
    password_hash VARCHAR(255) NULL,
    unit_system ENUM('metric','imperial') NOT NULL DEFAULT 'metric',
    disabled_at DATETIME(3) NULL,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY app_user_email_unique (email)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE user_session (
    id VARCHAR(64) NOT NULL PRIMARY KEY,
    user_id VARCHAR(36) NOT NULL,
    expires_at DATETIME(3) NOT NULL,
    created_at DATETIME(3) NOT NULL,
    last_seen_at DATETIME(3) NOT NULL,
    user_agent VARCHAR(255) NULL,
    KEY user_session_user_id (user_id),
    CONSTRAINT user_session_user_fk FOREIGN KEY (user_id) REFERENCES app_user (id) ON DELETE CASCADE
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE user_site_access (
    user_id VARCHAR(36) NOT NULL,
    site_id INT UNSIGNED NOT NULL,
    created_at DATETIME(3) NOT NULL,
    PRIMARY KEY (user_id, site_id),
    KEY user_site_access_site (site_id),
    CONSTRAINT user_site_access_user_fk FOREIGN KEY (user_id) REFERENCES app_user (id) ON DELETE CASCADE,
    CONSTRAINT user_site_access_site_fk FOREIGN KEY (site_id) REFERENCES site (id) ON DELETE CASCADE
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE user_invitation (
    token_hash CHAR(64) NOT NULL PRIMARY KEY,
    user_id VARCHAR(36) NOT NULL,
    invited_by VARCHAR(36) NULL,
    expires_at DATETIME(3) NOT NULL,
    used_at DATETIME(3) NULL,
    created_at DATETIME(3) NOT NULL,
    KEY user_invitation_user (user_id),
    CONSTRAINT user_invitation_user_fk FOREIGN KEY (user_id) REFERENCES app_user (id) ON DELETE CASCADE
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE sign_in_throttle (
    throttle_key VARCHAR(191) NOT NULL PRIMARY KEY,
    failures INT UNSIGNED NOT NULL,
    window_started_at DATETIME(3) NOT NULL,
    locked_until DATETIME(3) NULL,
    updated_at DATETIME(3) NOT NULL
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE mail_outbox (
    id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    dedupe_key VARCHAR(191) NULL,
    to_addresses TEXT NOT NULL,
    subject VARCHAR(255) NOT NULL,
    text_body MEDIUMTEXT NOT NULL,
    status ENUM('pending','sending','sent','dead') NOT NULL DEFAULT 'pending',
    attempts INT UNSIGNED NOT NULL DEFAULT 0,
    next_attempt_at DATETIME(3) NOT NULL,
    claim_token VARCHAR(64) NULL,
    claimed_until DATETIME(3) NULL,
    last_error TEXT NULL,
    sent_at DATETIME(3) NULL,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY mail_outbox_dedupe_unique (dedupe_key),
    KEY mail_outbox_due (status, next_attempt_at)
  ) ENGINE=InnoDB`);
};

export const down: Migration = async ({ context: sequelize }) => {
  for (const table of [
    "mail_outbox",
    "sign_in_throttle",
    "user_invitation",
    "user_site_access",
    "user_session",
    "app_user",
    "site",
  ]) {
    await sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
};
