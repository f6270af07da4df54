import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

const LEVEL = "ENUM('low','moderate','high','very_high') NOT NULL DEFAULT 'low'";

/** Areas, assets, lube points, grease guns, services, changeovers, mixing incidents and idempotency keys. */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`CREATE TABLE area (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    code VARCHAR(16) NOT NULL,
    name VARCHAR(120) NOT NULL,
    sort_order INT NOT NULL DEFAULT 0,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY area_site_code (site_id, code),
    CONSTRAINT area_site_fk FOREIGN KEY (site_id) REFERENCES site (id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE asset (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    area_id INT UNSIGNED NOT NULL,
    tag VARCHAR(32) NOT NULL,
    name VARCHAR(120) NOT NULL,
    kind ENUM('motor','pump','fan','conveyor','gearbox','crusher','mill','other') NOT NULL DEFAULT 'other',
    frame_size VARCHAR(32) NULL,
    notes TEXT NULL,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY asset_site_tag (site_id, tag),
    KEY asset_area (area_id),
    CONSTRAINT asset_site_fk FOREIGN KEY (site_id) REFERENCES site (id),
    CONSTRAINT asset_area_fk FOREIGN KEY (area_id) REFERENCES area (id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE grease_gun (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    label VARCHAR(60) NOT NULL,
    grams_per_stroke DECIMAL(6,3) NOT NULL,
    calibrated_on DATE NOT NULL,
    notes VARCHAR(200) NULL,
    created_at DATETIME(3) NOT NULL,
    UNIQUE KEY grease_gun_site_label (site_id, label),
    CONSTRAINT grease_gun_site_fk FOREIGN KEY (site_id) REFERENCES site (id),
    CONSTRAINT grease_gun_stroke_positive CHECK (grams_per_stroke > 0)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE lube_point (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    asset_id INT UNSIGNED NOT NULL,
    tag_code CHAR(8) NOT NULL,
    name VARCHAR(120) NOT NULL,
    bearing_type ENUM('ball','cylindrical_roller','needle_roller','spherical_roller','tapered_roller') NOT NULL,
    bearing_designation VARCHAR(40) NULL,
    bore_mm DECIMAL(7,2) NOT NULL,
    outside_diameter_mm DECIMAL(7,2) NOT NULL,
    width_mm DECIMAL(7,2) NOT NULL,
    speed_rpm DECIMAL(8,1) NOT NULL,
    operating_temperature_c DECIMAL(5,1) NULL,
    running_hours_per_day DECIMAL(4,1) NOT NULL DEFAULT 24,
    vertical_shaft TINYINT(1) NOT NULL DEFAULT 0,
    contamination ${LEVEL},
    moisture ${LEVEL},
    vibration ${LEVEL},
    food_grade_required TINYINT(1) NOT NULL DEFAULT 0,
    replenishment ENUM('side','centre') NOT NULL DEFAULT 'side',
    sealed_for_life TINYINT(1) NOT NULL DEFAULT 0,
    assigned_grease_id INT UNSIGNED NULL,
    current_grease_id INT UNSIGNED NULL,
    interval_hours_override DECIMAL(9,1) NULL,
    quantity_grams_override DECIMAL(8,2) NULL,
    override_reason VARCHAR(300) NULL,
    maker_interval_hours DECIMAL(9,1) NULL,
    maker_quantity_grams DECIMAL(8,2) NULL,
    maker_note VARCHAR(300) NULL,
    interval_hours DECIMAL(9,1) NULL,
    quantity_grams DECIMAL(8,2) NULL,
    last_serviced_at DATETIME(3) NULL,
    next_due_at DATETIME(3) NULL,
    route_order INT NOT NULL DEFAULT 0,
    version INT UNSIGNED NOT NULL DEFAULT 1,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY lube_point_tag (tag_code),
    KEY lube_point_asset (asset_id),
    KEY lube_point_due (site_id, next_due_at),
    CONSTRAINT lube_point_site_fk FOREIGN KEY (site_id) REFERENCES site (id),
    CONSTRAINT lube_point_asset_fk FOREIGN KEY (asset_id) REFERENCES asset (id),
    CONSTRAINT lube_point_assigned_fk FOREIGN KEY (assigned_grease_id) REFERENCES grease (id),
    CONSTRAINT lube_point_current_fk FOREIGN KEY (current_grease_id) REFERENCES grease (id),
    CONSTRAINT lube_point_dims CHECK (bore_mm > 0 AND outside_diameter_mm > bore_mm AND width_mm > 0 AND speed_rpm >= 0),
    CONSTRAINT lube_point_hours CHECK (running_hours_per_day > 0 AND running_hours_per_day <= 24)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE changeover (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    point_id INT UNSIGNED NOT NULL,
    from_grease_id INT UNSIGNED NULL,
    to_grease_id INT UNSIGNED NOT NULL,
    method ENUM('purge','clean_out') NOT NULL,
    shortened_interval_hours DECIMAL(9,1) NULL,
    services_planned SMALLINT UNSIGNED NOT NULL DEFAULT 3,
    services_done SMALLINT UNSIGNED NOT NULL DEFAULT 0,
    state ENUM('planned','in_progress','completed','cancelled') NOT NULL DEFAULT 'planned',
    notes VARCHAR(500) NULL,
    planned_by VARCHAR(36) NULL,
    created_at DATETIME(3) NOT NULL,
    completed_at DATETIME(3) NULL,
    KEY changeover_point (point_id, state),
    CONSTRAINT changeover_point_fk FOREIGN KEY (point_id) REFERENCES lube_point (id),
    CONSTRAINT changeover_to_fk FOREIGN KEY (to_grease_id) REFERENCES grease (id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE service_record (
    id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    point_id INT UNSIGNED NOT NULL,
    grease_id INT UNSIGNED NOT NULL,
    grams DECIMAL(8,2) NOT NULL,
    strokes SMALLINT UNSIGNED NULL,
    gun_id INT UNSIGNED NULL,
    planned_grams DECIMAL(8,2) NULL,
    quantity_flag ENUM('ok','over','under') NULL,
    back_pressure TINYINT(1) NOT NULL DEFAULT 0,
    purge_seen TINYINT(1) NOT NULL DEFAULT 0,
    noise TINYINT(1) NOT NULL DEFAULT 0,
    housing_temperature_c DECIMAL(5,1) NULL,
    notes VARCHAR(1000) NULL,
    changeover_id INT UNSIGNED NULL,
    performed_by VARCHAR(36) NOT NULL,
    performed_at DATETIME(3) NOT NULL,
    KEY service_point_time (point_id, performed_at),
    KEY service_site_time (site_id, performed_at),
    CONSTRAINT service_point_fk FOREIGN KEY (point_id) REFERENCES lube_point (id),
    CONSTRAINT service_grease_fk FOREIGN KEY (grease_id) REFERENCES grease (id),
    CONSTRAINT service_grams_positive CHECK (grams > 0)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE mixing_incident (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    site_id INT UNSIGNED NOT NULL,
    point_id INT UNSIGNED NULL,
    kind ENUM('refused_mix','changeover_exception','found_after_fact') NOT NULL,
    grease_in_point_id INT UNSIGNED NULL,
    grease_offered_id INT UNSIGNED NULL,
    verdict ENUM('compatible','borderline','incompatible','unknown') NOT NULL,
    reasons_json MEDIUMTEXT NOT NULL,
    state ENUM('open','investigating','closed') NOT NULL DEFAULT 'open',
    root_cause TEXT NULL,
    corrective_action TEXT NULL,
    opened_by VARCHAR(36) NULL,
    opened_at DATETIME(3) NOT NULL,
    closed_by VARCHAR(36) NULL,
    closed_at DATETIME(3) NULL,
    KEY incident_site_time (site_id, opened_at),
    KEY incident_point (point_id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE idempotency_key (
    user_id VARCHAR(36) NOT NULL,
    idem_key VARCHAR(255) NOT NULL,
    request_hash CHAR(64) NOT NULL,
    status_code SMALLINT UNSIGNED NOT NULL,
    response_json MEDIUMTEXT NOT NULL,
    created_at DATETIME(3) NOT NULL,
    PRIMARY KEY (user_id, idem_key),
    KEY idempotency_created (created_at)
  ) ENGINE=InnoDB`);
};

export const down: Migration = async ({ context: sequelize }) => {
  for (const table of ["idempotency_key", "mixing_incident", "service_record", "changeover", "lube_point", "grease_gun", "asset", "area"]) {
    await sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
};
