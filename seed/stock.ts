import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import { tagCodeFrom } from "@/lib/domain/service";
import { reorderPointGrams } from "@/lib/server/queries/stock";
import { seeded } from "./points";

const LOCATIONS: Record<string, [string, string][]> = {
  KBC: [
    ["STORE", "Main storeroom"],
    ["KILN", "Kiln platform cabinet"],
  ],
  MFW: [
    ["STORE", "Stores building"],
    ["SLG", "Sludge hall cabinet"],
  ],
};

/**
 * Stock for every demo grease on both sites, in two locations each, with a receipt in the ledger for every lot.
 * The motor grease at Kestrel Bay sits just above its reorder point, one lot expires within a month, and there
 * is a purchase request in each state.
 */
export async function seedStock(sequelize: Sequelize, t: Transaction, now: Date, users: { clerkId: string; leadId: string }): Promise<void> {
  const rand = seeded(424242);
  const DAY = 86_400_000;
  const day = (offset: number) => new Date(now.getTime() + offset * DAY).toISOString().slice(0, 10);
  const sites = await sequelize.query<{ id: number; code: string }>("SELECT id, code FROM site ORDER BY id", { type: QueryTypes.SELECT, transaction: t });
  const packs = await sequelize.query<{ pack_id: number; grease_id: number; code: string; grams: number; shelf: number | null; lead: number | null }>(
    `SELECT p.id AS pack_id, g.id AS grease_id, g.code, p.net_mass_grams AS grams, g.shelf_life_months AS shelf, s.lead_time_days AS lead
     FROM grease_pack p JOIN grease g ON g.id = p.grease_id JOIN supplier s ON s.id = g.supplier_id ORDER BY g.id, p.net_mass_grams`,
    { type: QueryTypes.SELECT, transaction: t },
  );
  const firstPack = new Map<number, (typeof packs)[number]>();
  for (const p of packs) if (!firstPack.has(Number(p.grease_id)) || p.grams === 400) firstPack.set(Number(p.grease_id), p);

  for (const site of sites) {
    const locations: number[] = [];
    for (const [code, name] of LOCATIONS[site.code] ?? []) {
      const [id] = await sequelize.query("INSERT INTO storage_location (site_id, code, name, created_at) VALUES (?, ?, ?, ?)", { replacements: [site.id, code, name, now], type: QueryTypes.INSERT, transaction: t });
      locations.push(Number(id));
    }
    for (const pack of firstPack.values()) {
      const lead = pack.lead === null ? 14 : Number(pack.lead);
      const rp = (await reorderPointGrams(Number(site.id), Number(pack.grease_id), lead, now, t)).grams;
      const rpContainers = Math.ceil(rp / Number(pack.grams));
      const justAbove = site.code === "KBC" && pack.code === "GL-EM2";
      const total = justAbove ? rpContainers + 1 : Math.max(4, Math.ceil(rpContainers * (1.8 + rand())));
      const split = justAbove ? [total, 0] : [Math.ceil(total * 0.7), Math.floor(total * 0.3)];
      for (const [i, quantity] of split.entries()) {
        if (quantity <= 0) continue;
        const received = day(-20 - Math.floor(rand() * 120));
        const expiring = site.code === "KBC" && pack.code === "GL-CA3" && i === 0;
        const expires = expiring ? day(20) : pack.shelf ? day(Number(pack.shelf) * 30 - 60 - Math.floor(rand() * 200)) : null;
        const bytes = new Uint8Array(8).map(() => Math.floor(rand() * 256));
        const [lotId] = await sequelize.query(
          `INSERT INTO stock_lot (site_id, grease_id, pack_id, location_id, lot_number, label_code, manufactured_on, expires_on, expiry_source, received_on, on_hand, created_at, updated_at)
           VALUES (?, ?, ?, ?, ?, ?, NULL, ?, ?, ?, ?, ?, ?)`,
          {
            replacements: [site.id, pack.grease_id, pack.pack_id, locations[i], `L${26000 + Math.floor(rand() * 9000)}`, tagCodeFrom(bytes), expires, expires ? "label" : "unknown", received, quantity, now, now],
            type: QueryTypes.INSERT,
            transaction: t,
          },
        );
        await sequelize.query("INSERT INTO stock_movement (site_id, lot_id, kind, quantity, reason, user_id, created_at) VALUES (?, ?, 'receipt', ?, 'Opening stock', ?, ?)", {
          replacements: [site.id, lotId, quantity, users.clerkId, new Date(`${received}T08:00:00Z`)],
          transaction: t,
        });
      }
    }
  }
  const kbc = sites.find((s) => s.code === "KBC")!;
  const request = async (code: string, state: "requested" | "ordered" | "received", packs: number, ageDays: number) => {
    const pack = [...firstPack.values()].find((p) => p.code === code)!;
    await sequelize.query(
      "INSERT INTO purchase_request (site_id, grease_id, pack_id, packs, state, note, created_by, created_at, ordered_at, received_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)",
      {
        replacements: [kbc.id, pack.grease_id, pack.pack_id, packs, state, "Demo request", users.leadId, new Date(now.getTime() - ageDays * DAY), state !== "requested" ? new Date(now.getTime() - (ageDays - 1) * DAY) : null, state === "received" ? new Date(now.getTime() - 2 * DAY) : null],
        transaction: t,
      },
    );
  };
  await request("GL-LX220", "requested", 12, 1);
  await request("GL-CS2", "ordered", 24, 6);
  await request("GL-MP2", "received", 20, 30);
}
