import type { Sequelize } from "sequelize";
import { SequelizeStorage, Umzug, type MigrationFn } from "umzug";
import { MIGRATIONS } from "./migrations";

export type Migration = MigrationFn<Sequelize>;

/** The versioned schema migrations listed in `models/migrations/index.ts`, recorded in `schema_migration`. */
export function createMigrator(sequelize: Sequelize, logger: Pick<Console, "info" | "warn" | "error"> = console) {
  return new Umzug<Sequelize>({
    migrations: MIGRATIONS.map((m) => ({ name: m.name, up: m.up, down: m.down })),
    context: sequelize,
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migration" }),
    logger: { info: (m) => logger.info(m), warn: (m) => logger.warn(m), error: (m) => logger.error(m), debug: () => {} },
  });
}
