import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

/**
 * The lead works incidents: each step (opened, investigating, note, closed, reopened) is a row of the incident's
 * timeline; the incident row carries a version so two people closing it at once cannot overwrite each other, and
 * a description for mixes found after the fact.
 */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`ALTER TABLE mixing_incident
    ADD COLUMN description TEXT NULL AFTER reasons_json,
    ADD COLUMN version INT UNSIGNED NOT NULL DEFAULT 0 AFTER closed_at,
    ADD KEY incident_state (state, opened_at)`);
  await q(`CREATE TABLE incident_event (
    id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    incident_id INT UNSIGNED NOT NULL,
    at DATETIME(3) NOT NULL,
    actor_id VARCHAR(36) NULL,
    kind ENUM('opened','investigating','note','closed','reopened') NOT NULL,
    note TEXT NULL,
    KEY incident_event_incident (incident_id, at),
    CONSTRAINT incident_event_incident_fk FOREIGN KEY (incident_id) REFERENCES mixing_incident (id)
  ) ENGINE=InnoDB`);
  // Incidents opened before the timeline existed get their opening step.
  await q(`INSERT INTO incident_event (incident_id, at, actor_id, kind, note) SELECT id, opened_at, opened_by, 'opened', NULL FROM mixing_incident`);
};

export const down: Migration = async ({ context: sequelize }) => {
  await sequelize.query("DROP TABLE IF EXISTS incident_event");
  await sequelize.query("ALTER TABLE mixing_incident DROP INDEX incident_state, DROP COLUMN version, DROP COLUMN description");
};
