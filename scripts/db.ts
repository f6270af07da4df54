// Database commands: `migrate`, `migrate:down`, `seed` (`--if-empty` seeds only an empty database), `status`,
// `scale [--size 0.01]` (the plant-scale data set, into an empty database).
// Run through tsx with the react-server condition (see package.json), with the DATABASE_* variables set.
import { getSequelize } from "@/lib/server/db";
import { createMigrator } from "@/models/migrator";
import { databaseIsEmpty, seedDemo } from "@/seed/demo";
import { seedScale } from "@/seed/scale";

const [command = "migrate", ...flags] = process.argv.slice(2);
const quietLogger = { info: () => {}, warn: console.warn, error: console.error };

async function main() {
  // The process-wide instance: the seed writes through the same query functions as the app.
  const sequelize = getSequelize();
  try {
    const migrator = createMigrator(sequelize, quietLogger);
    if (command === "migrate") {
      const applied = await migrator.up();
      console.log(
        applied.length
          ? `applied ${applied.length} migration(s): ${applied.map((m) => m.name).join(", ")}`
          : "schema is up to date",
      );
    } else if (command === "migrate:down") {
      const reverted = await migrator.down();
      console.log(`reverted ${reverted.map((m) => m.name).join(", ") || "nothing"}`);
    } else if (command === "status") {
      const pending = await migrator.pending();
      console.log(
        pending.length ? `pending: ${pending.map((m) => m.name).join(", ")}` : "no pending migrations",
      );
    } else if (command === "seed") {
      if (flags.includes("--if-empty") && !(await databaseIsEmpty(sequelize))) {
        console.log("database already has data; demo seed skipped");
      } else {
        await seedDemo(sequelize);
        console.log("demo data written");
      }
    } else if (command === "scale") {
      const at = flags.indexOf("--size");
      const size = at >= 0 ? Number(flags[at + 1]) : 1;
      if (!(size > 0 && size <= 1))
        throw new Error("--size is a fraction of the full plant, more than 0 and at most 1");
      const started = Date.now();
      const counts = await seedScale(sequelize, { size });
      console.log(
        `scale data written in ${Math.round((Date.now() - started) / 1000)} s: ${JSON.stringify(counts)}`,
      );
    } else {
      throw new Error(`unknown command ${command}`);
    }
  } finally {
    await sequelize.close();
  }
}

main().catch((error) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
