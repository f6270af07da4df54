import type { Sequelize, Transaction } from "sequelize";
import type { GreaseInput } from "@/lib/validation/grease";
import { insertGrease } from "@/lib/server/queries/greases";

/** Invented suppliers (names made up for the demo). */
export const DEMO_SUPPLIERS = [
  { name: "Brackenridge Lubricants", contactName: "Orla Fenwick", contactEmail: "orders@brackenridge.example", leadTimeDays: 10 },
  { name: "Norrvik Tribology", contactName: "Sune Aaltonen", contactEmail: "sales@norrvik.example", leadTimeDays: 21 },
  { name: "Oakhollow Oil Company", contactName: null, contactEmail: "desk@oakhollow.example", leadTimeDays: 7 },
  { name: "Vessery Chemie", contactName: "Margit Olander", contactEmail: "service@vessery.example", leadTimeDays: 28 },
];

const cartridge = { kind: "cartridge" as const, netMassGrams: 400 };
const pail = { kind: "pail" as const, netMassGrams: 18_000 };
const keg = { kind: "keg" as const, netMassGrams: 50_000 };
const drum = { kind: "drum" as const, netMassGrams: 180_000 };
const tube = { kind: "tube" as const, netMassGrams: 70 };

type Demo = Omit<GreaseInput, "notes" | "workedPenetration" | "isoVg"> & Partial<Pick<GreaseInput, "notes" | "workedPenetration" | "isoVg">>;

/**
 * Invented greases with realistic properties (values typical of their class, not of any real product).
 * Covers 14 thickener types and 6 base-oil types.
 */
export const DEMO_GREASES: Demo[] = [
  { code: "GL-EM2", name: "Brackenridge Aurum EM2", supplier: "Brackenridge Lubricants", thickener: "polyurea", baseOilType: "mineral", viscosity40: 100, viscosity100: 11, nlgiGrade: "2", workedPenetration: 280, isoVg: 100, droppingPointC: 260, minTemperatureC: -30, maxTemperatureC: 150, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 36, packs: [cartridge, keg], notes: "Electric-motor bearing grease." },
  { code: "GL-LX2", name: "Norrvik Fennel LX 2", supplier: "Norrvik Tribology", thickener: "lithium_complex", baseOilType: "mineral", viscosity40: 100, viscosity100: 11.2, nlgiGrade: "2", workedPenetration: 275, droppingPointC: 280, minTemperatureC: -30, maxTemperatureC: 150, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 60, packs: [cartridge, pail], notes: "Electric-motor grease, lithium complex." },
  { code: "GL-LX220", name: "Oakhollow Lodestar 220", supplier: "Oakhollow Oil Company", thickener: "lithium_complex", baseOilType: "mineral", viscosity40: 220, viscosity100: 19, nlgiGrade: "2", droppingPointC: 275, minTemperatureC: -20, maxTemperatureC: 150, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 60, packs: [cartridge, pail, drum] },
  { code: "GL-MP2", name: "Vessery Alba MP2", supplier: "Vessery Chemie", thickener: "lithium_12_hydroxy", baseOilType: "mineral", viscosity40: 150, viscosity100: 14.5, nlgiGrade: "2", workedPenetration: 280, droppingPointC: 190, minTemperatureC: -25, maxTemperatureC: 120, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 60, packs: [cartridge, keg] },
  { code: "GL-L3", name: "Brackenridge Cobble L3", supplier: "Brackenridge Lubricants", thickener: "lithium", baseOilType: "mineral", viscosity40: 100, viscosity100: 10.5, nlgiGrade: "3", droppingPointC: 185, minTemperatureC: -25, maxTemperatureC: 110, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 60, packs: [cartridge] },
  { code: "GL-CS2", name: "Norrvik Harrow CS2", supplier: "Norrvik Tribology", thickener: "calcium_sulfonate", baseOilType: "mineral", viscosity40: 320, viscosity100: 24, nlgiGrade: "2", droppingPointC: 300, minTemperatureC: -20, maxTemperatureC: 180, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 48, packs: [cartridge, pail], notes: "Wet, heavily loaded bearings (kiln tyres, crusher)." },
  { code: "GL-HT460", name: "Oakhollow Kiln HT 460", supplier: "Oakhollow Oil Company", thickener: "clay", baseOilType: "mineral", viscosity40: 460, viscosity100: 31, nlgiGrade: "2", minTemperatureC: -10, maxTemperatureC: 200, foodGrade: "none", solidAdditives: ["graphite"], shelfLifeMonths: 36, packs: [cartridge, keg], notes: "Non-melting clay grease for hot, slow bearings." },
  { code: "GL-PG1", name: "Vessery Glycon G1", supplier: "Vessery Chemie", thickener: "lithium_complex", baseOilType: "pag", viscosity40: 220, viscosity100: 38, nlgiGrade: "1", droppingPointC: 260, minTemperatureC: -30, maxTemperatureC: 160, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 36, packs: [cartridge], notes: "Polyglycol base: keep apart from mineral-oil greases." },
  { code: "GL-FG2", name: "Brackenridge Pura AL2", supplier: "Brackenridge Lubricants", thickener: "aluminium_complex", baseOilType: "pao", viscosity40: 150, viscosity100: 19, nlgiGrade: "2", droppingPointC: 250, minTemperatureC: -25, maxTemperatureC: 160, foodGrade: "H1", solidAdditives: [], shelfLifeMonths: 36, packs: [cartridge, pail], notes: "Food-grade (H1) for the lime bagging line." },
  { code: "GL-FG15", name: "Norrvik Clarion CS 1.5", supplier: "Norrvik Tribology", thickener: "calcium_sulfonate", baseOilType: "pao", viscosity40: 220, viscosity100: 25, nlgiGrade: "1.5", droppingPointC: 290, minTemperatureC: -30, maxTemperatureC: 170, foodGrade: "H1", solidAdditives: [], shelfLifeMonths: 48, packs: [cartridge] },
  { code: "GL-SI2", name: "Oakhollow Siltra V2", supplier: "Oakhollow Oil Company", thickener: "silica", baseOilType: "silicone", viscosity40: 100, viscosity100: 40, nlgiGrade: "2", minTemperatureC: -40, maxTemperatureC: 200, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 60, packs: [tube, cartridge], notes: "Valves and seals; not for rolling bearings under load." },
  { code: "GL-PF2", name: "Vessery Fluoro KP2", supplier: "Vessery Chemie", thickener: "ptfe", baseOilType: "pfpe", viscosity40: 460, viscosity100: 45, nlgiGrade: "2", minTemperatureC: -20, maxTemperatureC: 250, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 120, packs: [tube, cartridge], notes: "Perfluoropolyether: mixes with nothing else; clean the housing before changing to it." },
  { code: "GL-BX2", name: "Brackenridge Baryte WR2", supplier: "Brackenridge Lubricants", thickener: "barium_complex", baseOilType: "mineral", viscosity40: 220, viscosity100: 18, nlgiGrade: "2", droppingPointC: 220, minTemperatureC: -20, maxTemperatureC: 140, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 48, packs: [cartridge, pail] },
  { code: "GL-CX2", name: "Norrvik Quarrymaster CX2", supplier: "Norrvik Tribology", thickener: "calcium_complex", baseOilType: "mineral", viscosity40: 460, viscosity100: 30, nlgiGrade: "2", droppingPointC: 270, minTemperatureC: -20, maxTemperatureC: 150, foodGrade: "none", solidAdditives: ["molybdenum_disulfide"], shelfLifeMonths: 48, packs: [cartridge, keg, drum], notes: "Slow, shock-loaded bearings; contains MoS₂." },
  { code: "GL-SF00", name: "Oakhollow Gearwell SF00", supplier: "Oakhollow Oil Company", thickener: "sodium", baseOilType: "mineral", viscosity40: 680, viscosity100: 38, nlgiGrade: "00", minTemperatureC: -20, maxTemperatureC: 100, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 36, packs: [pail], notes: "Semi-fluid grease for enclosed gear units." },
  { code: "GL-ES2", name: "Vessery Velora E2", supplier: "Vessery Chemie", thickener: "lithium_complex", baseOilType: "ester", viscosity40: 46, viscosity100: 8, nlgiGrade: "2", droppingPointC: 250, minTemperatureC: -50, maxTemperatureC: 140, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 36, packs: [tube, cartridge], notes: "High-speed spindle bearings." },
  { code: "GL-SS2", name: "Brackenridge Aurum SS2", supplier: "Brackenridge Lubricants", thickener: "polyurea_shear_stable", baseOilType: "pao", viscosity40: 100, viscosity100: 14, nlgiGrade: "2", droppingPointC: 270, minTemperatureC: -40, maxTemperatureC: 180, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 48, packs: [cartridge, keg] },
  { code: "GL-CA3", name: "Norrvik Tallow Cup 3", supplier: "Norrvik Tribology", thickener: "calcium", baseOilType: "mineral", viscosity40: 68, viscosity100: 8, nlgiGrade: "3", droppingPointC: 95, minTemperatureC: -10, maxTemperatureC: 60, foodGrade: "none", solidAdditives: [], shelfLifeMonths: 24, packs: [cartridge] },
];

/** One lab mixture test (invented results): calcium sulfonate with lithium complex, which no default chart covers. */
export const DEMO_EVIDENCE = {
  codes: ["GL-CS2", "GL-LX2"] as const,
  kind: "lab_mixture_test" as const,
  verdict: "compatible" as const,
  title: "Mixture test of Harrow CS2 with Fennel LX 2 (Marlow Fen lab report 2026-114)",
  summary: "Neat greases and 10/90, 50/50 and 90/10 mixtures: dropping point, worked penetration after prolonged working, storage stability.",
  testData: {
    neatA: { droppingPointC: 300, workedPenetrationProlonged: 295, storagePenetrationChange: 6 },
    neatB: { droppingPointC: 280, workedPenetrationProlonged: 305, storagePenetrationChange: 8 },
    mixtures: [
      { ratioA: 10, ratioB: 90, result: { droppingPointC: 281, workedPenetrationProlonged: 304, storagePenetrationChange: 8 } },
      { ratioA: 50, ratioB: 50, result: { droppingPointC: 286, workedPenetrationProlonged: 301, storagePenetrationChange: 7 } },
      { ratioA: 90, ratioB: 10, result: { droppingPointC: 296, workedPenetrationProlonged: 297, storagePenetrationChange: 6 } },
    ],
  },
};

export async function seedCatalogue(sequelize: Sequelize, transaction: Transaction, now: Date, recordedBy: string | null): Promise<void> {
  for (const s of DEMO_SUPPLIERS) {
    await sequelize.query(
      "INSERT INTO supplier (name, contact_name, contact_email, lead_time_days, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?)",
      { replacements: [s.name, s.contactName, s.contactEmail, s.leadTimeDays, now, now], transaction },
    );
  }
  const ids = new Map<string, number>();
  for (const g of DEMO_GREASES) {
    ids.set(g.code, await insertGrease(g as GreaseInput, recordedBy, transaction, now));
  }
  const [a, b] = DEMO_EVIDENCE.codes.map((c) => ids.get(c)!) as [number, number];
  await sequelize.query(
    `INSERT INTO grease_pair_evidence (grease_low_id, grease_high_id, kind, verdict, title, summary, test_data, document_id, recorded_by, recorded_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, NULL, ?, ?)`,
    {
      replacements: [
        Math.min(a, b),
        Math.max(a, b),
        DEMO_EVIDENCE.kind,
        DEMO_EVIDENCE.verdict,
        DEMO_EVIDENCE.title,
        DEMO_EVIDENCE.summary,
        JSON.stringify({ greaseAId: a, greaseBId: b, ...DEMO_EVIDENCE.testData }),
        recordedBy,
        now,
      ],
      transaction,
    },
  );
}
