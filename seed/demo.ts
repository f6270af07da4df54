import { randomUUID } from "node:crypto";
import { hash } from "@node-rs/argon2";
import { QueryTypes, type Sequelize } from "sequelize";
import type { Role } from "@/lib/domain/permissions";
import { seedCatalogue } from "./catalogue";
import { seedIncidents } from "./incidents";
import { seedPoints } from "./points";
import { seedStock } from "./stock";

/** The one password of every demo sign-in (listed in the README). */
export const DEMO_PASSWORD = "demo-grease-2026";

/** Invented sites and people; any likeness to real ones is chance. */
export const DEMO_SITES = [
  { code: "KBC", name: "Kestrel Bay Cement Works", timezone: "Europe/London" },
  { code: "MFW", name: "Marlow Fen Water Treatment Works", timezone: "Europe/London" },
] as const;

export const DEMO_USERS: { email: string; name: string; role: Role; sites: string[] }[] = [
  { email: "admin@example.com", name: "Ada Brennock", role: "admin", sites: ["KBC", "MFW"] },
  { email: "lead@example.com", name: "Tomas Ferreira-Lind", role: "lead", sites: ["KBC", "MFW"] },
  { email: "clerk@example.com", name: "Priya Okonjo", role: "clerk", sites: ["KBC"] },
  { email: "tech@example.com", name: "Jonah Vestergaard", role: "technician", sites: ["KBC"] },
  { email: "auditor@example.com", name: "Helen Marsh-Adeyemi", role: "auditor", sites: ["KBC", "MFW"] },
];

export async function databaseIsEmpty(sequelize: Sequelize): Promise<boolean> {
  const [row] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM app_user", { type: QueryTypes.SELECT });
  return Number(row?.n ?? 0) === 0;
}

/** Writes the demo scenario in one transaction. */
export async function seedDemo(sequelize: Sequelize, now = new Date()): Promise<void> {
  const passwordHash = await hash(DEMO_PASSWORD, { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1 });
  await sequelize.transaction(async (transaction) => {
    const siteIds = new Map<string, number>();
    for (const site of DEMO_SITES) {
      const [id] = await sequelize.query(
        "INSERT INTO site (code, name, timezone, created_at, updated_at) VALUES (?, ?, ?, ?, ?)",
        { replacements: [site.code, site.name, site.timezone, now, now], transaction, type: QueryTypes.INSERT },
      );
      siteIds.set(site.code, Number(id));
    }
    let leadId: string | null = null;
    let techId: string | null = null;
    let clerkId: string | null = null;
    for (const user of DEMO_USERS) {
      const id = randomUUID();
      if (user.role === "lead") leadId = id;
      if (user.role === "technician") techId = id;
      if (user.role === "clerk") clerkId = id;
      await sequelize.query(
        `INSERT INTO app_user (id, email, name, role, status, password_hash, unit_system, created_at, updated_at)
         VALUES (?, ?, ?, ?, 'active', ?, 'metric', ?, ?)`,
        { replacements: [id, user.email, user.name, user.role, passwordHash, now, now], transaction },
      );
      for (const code of user.sites) {
        await sequelize.query("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, ?)", {
          replacements: [id, siteIds.get(code), now],
          transaction,
        });
      }
    }
    await seedCatalogue(sequelize, transaction, now, leadId);
    await seedPoints(sequelize, transaction, now, { techId: techId!, leadId: leadId! });
    await seedStock(sequelize, transaction, now, { clerkId: clerkId!, leadId: leadId! });
    await seedIncidents(sequelize, transaction, now, { techId: techId!, leadId: leadId! });
  });
}
