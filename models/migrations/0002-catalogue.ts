import type { MigrationFn } from "umzug";
import type { Sequelize } from "sequelize";

type Migration = MigrationFn<Sequelize>;

const THICKENERS =
  "'aluminium_complex','barium','barium_complex','calcium','calcium_12_hydroxy','calcium_complex','calcium_sulfonate','clay','lithium','lithium_12_hydroxy','lithium_complex','polyurea','polyurea_shear_stable','sodium','ptfe','silica','other'";
const BASE_OILS = "'mineral','pao','ester','pag','silicone','pfpe','other'";
const NLGI = "'000','00','0','1','1.5','2','2.5','3','4','5','6'";

/** Suppliers, greases, packs, data-sheet documents, product-pair evidence and per-site compatibility settings. */
export const up: Migration = async ({ context: sequelize }) => {
  const q = (sql: string) => sequelize.query(sql);
  await q(`CREATE TABLE supplier (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    name VARCHAR(120) NOT NULL,
    contact_name VARCHAR(120) NULL,
    contact_email VARCHAR(254) NULL,
    lead_time_days SMALLINT UNSIGNED NULL,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY supplier_name_unique (name)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE grease (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    code VARCHAR(32) NOT NULL,
    name VARCHAR(120) NOT NULL,
    supplier_id INT UNSIGNED NOT NULL,
    thickener ENUM(${THICKENERS}) NOT NULL,
    base_oil_type ENUM(${BASE_OILS}) NOT NULL,
    viscosity_40 DECIMAL(9,2) NOT NULL,
    viscosity_100 DECIMAL(9,2) NULL,
    nlgi_grade ENUM(${NLGI}) NOT NULL,
    worked_penetration SMALLINT UNSIGNED NULL,
    iso_vg SMALLINT UNSIGNED NULL,
    dropping_point_c SMALLINT NULL,
    min_temperature_c SMALLINT NULL,
    max_temperature_c SMALLINT NULL,
    food_grade ENUM('H1','H2','H3','none') NOT NULL DEFAULT 'none',
    solid_additives VARCHAR(200) NOT NULL DEFAULT '',
    shelf_life_months SMALLINT UNSIGNED NULL,
    notes TEXT NULL,
    version INT UNSIGNED NOT NULL DEFAULT 1,
    created_by VARCHAR(36) NULL,
    updated_by VARCHAR(36) NULL,
    created_at DATETIME(3) NOT NULL,
    updated_at DATETIME(3) NOT NULL,
    UNIQUE KEY grease_code_unique (code),
    KEY grease_thickener (thickener),
    KEY grease_supplier (supplier_id),
    CONSTRAINT grease_supplier_fk FOREIGN KEY (supplier_id) REFERENCES supplier (id),
    CONSTRAINT grease_viscosity_positive CHECK (viscosity_40 > 0 AND (viscosity_100 IS NULL OR (viscosity_100 > 0 AND viscosity_100 < viscosity_40))),
    CONSTRAINT grease_temperature_order CHECK (min_temperature_c IS NULL OR max_temperature_c IS NULL OR min_temperature_c < max_temperature_c)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE grease_pack (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    grease_id INT UNSIGNED NOT NULL,
    kind ENUM('cartridge','tube','pail','keg','drum') NOT NULL,
    net_mass_grams INT UNSIGNED NOT NULL,
    label VARCHAR(80) NULL,
    created_at DATETIME(3) NOT NULL,
    KEY grease_pack_grease (grease_id),
    CONSTRAINT grease_pack_grease_fk FOREIGN KEY (grease_id) REFERENCES grease (id) ON DELETE CASCADE,
    CONSTRAINT grease_pack_mass_positive CHECK (net_mass_grams > 0)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE stored_document (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    stored_name CHAR(36) NOT NULL,
    original_name VARCHAR(200) NOT NULL,
    content_type VARCHAR(100) NOT NULL,
    size_bytes INT UNSIGNED NOT NULL,
    sha256 CHAR(64) NOT NULL,
    uploaded_by VARCHAR(36) NULL,
    uploaded_at DATETIME(3) NOT NULL,
    UNIQUE KEY stored_document_name_unique (stored_name)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE grease_document (
    grease_id INT UNSIGNED NOT NULL,
    kind ENUM('sds','tds') NOT NULL,
    document_id INT UNSIGNED NOT NULL,
    PRIMARY KEY (grease_id, kind),
    CONSTRAINT grease_document_grease_fk FOREIGN KEY (grease_id) REFERENCES grease (id) ON DELETE CASCADE,
    CONSTRAINT grease_document_document_fk FOREIGN KEY (document_id) REFERENCES stored_document (id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE grease_pair_evidence (
    id INT UNSIGNED NOT NULL AUTO_INCREMENT PRIMARY KEY,
    grease_low_id INT UNSIGNED NOT NULL,
    grease_high_id INT UNSIGNED NOT NULL,
    kind ENUM('lab_mixture_test','supplier_statement') NOT NULL,
    verdict ENUM('compatible','borderline','incompatible') NOT NULL,
    title VARCHAR(200) NOT NULL,
    summary TEXT NULL,
    test_data MEDIUMTEXT NULL,
    document_id INT UNSIGNED NULL,
    recorded_by VARCHAR(36) NULL,
    recorded_at DATETIME(3) NOT NULL,
    KEY grease_pair_evidence_pair (grease_low_id, grease_high_id),
    CONSTRAINT grease_pair_evidence_low_fk FOREIGN KEY (grease_low_id) REFERENCES grease (id),
    CONSTRAINT grease_pair_evidence_high_fk FOREIGN KEY (grease_high_id) REFERENCES grease (id),
    CONSTRAINT grease_pair_evidence_document_fk FOREIGN KEY (document_id) REFERENCES stored_document (id),
    CONSTRAINT grease_pair_evidence_order CHECK (grease_low_id < grease_high_id)
  ) ENGINE=InnoDB`);
  await q(`CREATE TABLE compatibility_settings (
    site_id INT UNSIGNED NOT NULL PRIMARY KEY,
    enabled_charts VARCHAR(500) NOT NULL,
    viscosity_ratio_limit DECIMAL(6,2) NOT NULL,
    nlgi_step_limit DECIMAL(4,1) NOT NULL,
    dropping_point_allowance_c DECIMAL(6,1) NOT NULL,
    worked_penetration_allowance DECIMAL(6,1) NOT NULL,
    storage_change_allowance DECIMAL(6,1) NOT NULL,
    version INT UNSIGNED NOT NULL DEFAULT 1,
    updated_by VARCHAR(36) NULL,
    updated_at DATETIME(3) NOT NULL,
    CONSTRAINT compatibility_settings_site_fk FOREIGN KEY (site_id) REFERENCES site (id) ON DELETE CASCADE
  ) ENGINE=InnoDB`);
};

export const down: Migration = async ({ context: sequelize }) => {
  for (const table of [
    "compatibility_settings",
    "grease_pair_evidence",
    "grease_document",
    "stored_document",
    "grease_pack",
    "grease",
    "supplier",
  ]) {
    await sequelize.query(`DROP TABLE IF EXISTS ${table}`);
  }
};
