import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import {
  CHARTS,
  DEFAULT_COMPATIBILITY_SETTINGS,
  DEFAULT_MIXTURE_TEST_SETTINGS,
  evaluateMix,
  evaluateMixtureTest,
  type CompatibilitySettings,
  type GreaseProfile,
  type MixResult,
  type MixtureTestInput,
  type MixtureTestSettings,
  type PairEvidence,
} from "@/lib/domain/compatibility";
import type { EvaluateInput, EvidenceInput, GreaseRef } from "@/lib/validation/compatibility";
import { appendAudit } from "../audit";
import { queryBlock, type BatchStatement } from "../batch";
import { getSequelize } from "../db";
import { ConflictError, NotFoundError, ValidationError } from "../errors";
import { log } from "../log";
import { getGrease, greaseProfilesStatement, listGreases, profilesFromRows, type GreaseDto } from "./greases";
import { userSiteIds } from "./users";

export interface SiteCompatibilitySettings extends CompatibilitySettings, MixtureTestSettings {
  siteId: number;
  version: number;
}

/** A site's settings, or the defaults when the lead has not changed them (version 0). */
export async function getSiteSettings(
  siteId: number,
  transaction?: Transaction,
): Promise<SiteCompatibilitySettings> {
  const [rows] = await queryBlock([siteSettingsStatement(siteId)], transaction);
  return siteSettingsFromRows(siteId, rows!);
}

/** The engine's settings when a site has none of its own (or the user has no site). */
const defaultSettings = (): CompatibilitySettings & MixtureTestSettings => ({
  ...DEFAULT_COMPATIBILITY_SETTINGS,
  ...DEFAULT_MIXTURE_TEST_SETTINGS,
});

type SettingsRow = {
  version: number;
  enabled_charts: string;
  viscosity_ratio_limit: string | number;
  nlgi_step_limit: string | number;
  dropping_point_allowance_c: string | number;
  worked_penetration_allowance: string | number;
  storage_change_allowance: string | number;
};

function siteSettingsStatement(siteId: number): BatchStatement {
  return {
    sql: `SELECT version, enabled_charts, viscosity_ratio_limit, nlgi_step_limit, dropping_point_allowance_c,
            worked_penetration_allowance, storage_change_allowance FROM compatibility_settings WHERE site_id = ?`,
    params: [siteId],
  };
}

function siteSettingsFromRows(siteId: number, rows: unknown[]): SiteCompatibilitySettings {
  const row = rows[0] as SettingsRow | undefined;
  if (!row) return { siteId, version: 0, ...defaultSettings() };
  return {
    siteId,
    version: Number(row.version),
    enabledCharts: row.enabled_charts.split(",").filter(Boolean),
    viscosityRatioLimit: Number(row.viscosity_ratio_limit),
    nlgiStepLimit: Number(row.nlgi_step_limit),
    droppingPointAllowanceC: Number(row.dropping_point_allowance_c),
    workedPenetrationAllowance: Number(row.worked_penetration_allowance),
    storagePenetrationChangeAllowance: Number(row.storage_change_allowance),
  };
}

/** The site whose settings apply for a user: the requested one if they may see it, else their first, else none. */
async function settingsSiteFor(userId: string, siteId?: number): Promise<number | undefined> {
  const sites = await userSiteIds(userId);
  if (siteId !== undefined && !sites.includes(siteId)) throw new NotFoundError("No such site among yours.");
  return siteId ?? [...sites].sort((a, b) => a - b)[0];
}

/** The settings that apply for a user: the requested site if they may see it, else their first site, else defaults. */
export async function settingsForUser(
  userId: string,
  siteId?: number,
): Promise<SiteCompatibilitySettings | (CompatibilitySettings & MixtureTestSettings)> {
  const chosen = await settingsSiteFor(userId, siteId);
  if (chosen === undefined) return defaultSettings();
  return getSiteSettings(chosen);
}

export async function saveSiteSettings(
  input: {
    siteId: number;
    enabledCharts: string[];
    viscosityRatioLimit: number;
    nlgiStepLimit: number;
    droppingPointAllowanceC: number;
    workedPenetrationAllowance: number;
    storageChangeAllowance: number;
    version: number;
  },
  userId: string,
): Promise<void> {
  const known = new Set(CHARTS.map((c) => c.id));
  const unknown = input.enabledCharts.filter((id) => !known.has(id));
  if (unknown.length) throw new ValidationError({ enabledCharts: [`Unknown chart: ${unknown.join(", ")}.`] });
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ version: number }>(
      "SELECT version FROM compatibility_settings WHERE site_id = ? FOR UPDATE",
      {
        replacements: [input.siteId],
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    const current = row ? Number(row.version) : 0;
    if (current !== input.version) {
      throw new ConflictError(
        "stale_version",
        "Someone else changed these settings since you opened the page. Reload and apply your change again.",
      );
    }
    const values = [
      input.enabledCharts.join(","),
      input.viscosityRatioLimit,
      input.nlgiStepLimit,
      input.droppingPointAllowanceC,
      input.workedPenetrationAllowance,
      input.storageChangeAllowance,
      current + 1,
      userId,
      new Date(),
    ];
    if (row) {
      await sequelize.query(
        `UPDATE compatibility_settings SET enabled_charts = ?, viscosity_ratio_limit = ?, nlgi_step_limit = ?, dropping_point_allowance_c = ?,
           worked_penetration_allowance = ?, storage_change_allowance = ?, version = ?, updated_by = ?, updated_at = ? WHERE site_id = ?`,
        { replacements: [...values, input.siteId], transaction },
      );
    } else {
      await sequelize.query(
        `INSERT INTO compatibility_settings (enabled_charts, viscosity_ratio_limit, nlgi_step_limit, dropping_point_allowance_c,
           worked_penetration_allowance, storage_change_allowance, version, updated_by, updated_at, site_id) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
        { replacements: [...values, input.siteId], transaction },
      );
    }
    await appendAudit(
      {
        event: "rules.settings_changed",
        actorId: userId,
        siteId: input.siteId,
        subjectType: "compatibility_settings",
        subjectId: input.siteId,
        payload: {
          version: current + 1,
          enabledCharts: input.enabledCharts,
          viscosityRatioLimit: input.viscosityRatioLimit,
          nlgiStepLimit: input.nlgiStepLimit,
          droppingPointAllowanceC: input.droppingPointAllowanceC,
          workedPenetrationAllowance: input.workedPenetrationAllowance,
          storageChangeAllowance: input.storageChangeAllowance,
        },
      },
      transaction,
    );
  });
  log("info", "compatibility_settings_changed", {
    siteId: input.siteId,
    by: userId,
    enabledCharts: input.enabledCharts,
  });
}

export interface EvidenceDto extends PairEvidence {
  greaseAName: string;
  greaseBName: string;
  summary: string | null;
  testData: MixtureTestInput | null;
  documentId: number | null;
  recordedAt: string;
}

type EvidenceRow = {
  id: number;
  grease_low_id: number;
  grease_high_id: number;
  kind: PairEvidence["kind"];
  verdict: PairEvidence["verdict"];
  title: string;
  summary: string | null;
  test_data: string | null;
  document_id: number | null;
  original_name: string | null;
  recorded_at: Date;
  low_name: string;
  high_name: string;
};

function evidenceDto(r: EvidenceRow): EvidenceDto {
  let testData: MixtureTestInput | null = null;
  try {
    testData = r.test_data ? (JSON.parse(r.test_data) as MixtureTestInput) : null;
  } catch {
    testData = null;
  }
  return {
    id: Number(r.id),
    productA: Number(r.grease_low_id),
    productB: Number(r.grease_high_id),
    greaseAName: r.low_name,
    greaseBName: r.high_name,
    kind: r.kind,
    verdict: r.verdict,
    title: r.title,
    documentName: r.original_name,
    summary: r.summary,
    testData,
    documentId: r.document_id === null ? null : Number(r.document_id),
    recordedAt: new Date(r.recorded_at).toISOString(),
  };
}

/** Evidence records, newest first: one record by id, those of one pair, of one grease, or all. */
export async function listEvidence(
  filter: { id?: number; greaseId?: number; pair?: [number, number] } = {},
  transaction?: Transaction,
): Promise<EvidenceDto[]> {
  const [rows] = await queryBlock([evidenceStatement(filter)], transaction);
  return (rows as EvidenceRow[]).map(evidenceDto);
}

function evidenceStatement(filter: { id?: number; greaseId?: number; pair?: [number, number] }): BatchStatement {
  const where: string[] = [];
  const params: number[] = [];
  if (filter.id) {
    where.push("e.id = ?");
    params.push(filter.id);
  } else if (filter.pair) {
    where.push("e.grease_low_id = ? AND e.grease_high_id = ?");
    params.push(Math.min(...filter.pair), Math.max(...filter.pair));
  } else if (filter.greaseId) {
    where.push("(e.grease_low_id = ? OR e.grease_high_id = ?)");
    params.push(filter.greaseId, filter.greaseId);
  }
  return {
    sql: `SELECT e.*, d.original_name, gl.name AS low_name, gh.name AS high_name FROM grease_pair_evidence e
     JOIN grease gl ON gl.id = e.grease_low_id JOIN grease gh ON gh.id = e.grease_high_id
     LEFT JOIN stored_document d ON d.id = e.document_id
     ${where.length ? `WHERE ${where.join(" AND ")}` : ""} ORDER BY e.recorded_at DESC, e.id DESC`,
    params,
  };
}

export function profileOf(grease: GreaseDto): GreaseProfile {
  return {
    productId: grease.id,
    name: grease.name,
    thickener: grease.thickener,
    baseOilType: grease.baseOilType,
    viscosity40: grease.viscosity40,
    nlgiGrade: grease.nlgiGrade,
    foodGrade: grease.foodGrade,
    solidAdditives: grease.solidAdditives,
  };
}

/** The engine's verdict for two greases (catalogue ids or typed-in profiles) under the caller's site settings. */
export async function evaluatePair(input: EvaluateInput, userId: string): Promise<MixResult> {
  const ids = [input.a, input.b].flatMap((ref) => ("greaseId" in ref ? [ref.greaseId] : []));
  const pair = ids.length === 2 && ids[0] !== ids[1] ? ([ids[0], ids[1]] as [number, number]) : null;
  // The profiles, the site's settings and the pair's evidence: one compound statement, one round trip.
  const site = await settingsSiteFor(userId, input.siteId);
  const reads: BatchStatement[] = [];
  const at = (statement: BatchStatement | null) => (statement ? reads.push(statement) - 1 : -1);
  const [profilesAt, settingsAt, evidenceAt] = [
    at(ids.length ? greaseProfilesStatement(ids) : null),
    at(site !== undefined ? siteSettingsStatement(site) : null),
    at(pair ? evidenceStatement({ pair }) : null),
  ];
  const sets = reads.length ? await queryBlock(reads) : [];
  const profiles = profilesAt >= 0 ? profilesFromRows(sets[profilesAt]!) : new Map<number, GreaseProfile>();
  const settings =
    site !== undefined ? siteSettingsFromRows(site, sets[settingsAt]!) : defaultSettings();
  const evidence = evidenceAt >= 0 ? (sets[evidenceAt] as EvidenceRow[]).map(evidenceDto) : [];
  const resolve = (ref: GreaseRef, field: string): GreaseProfile => {
    if (!("greaseId" in ref)) return { ...ref.profile, productId: null, name: undefined };
    const profile = profiles.get(ref.greaseId);
    if (!profile) throw new ValidationError({ [`${field}.greaseId`]: ["No grease with this id."] });
    return profile;
  };
  const [a, b] = [resolve(input.a, "a"), resolve(input.b, "b")];
  return evaluateMix(
    a,
    b,
    { foodGradeRequired: input.point?.foodGradeRequired ?? false, evidence },
    settings,
  );
}

/** One grease against every other product in the catalogue, with the evidence on record. */
export async function compatibilityWithAll(greaseId: number, userId: string) {
  const [greases, evidence, settings] = await Promise.all([
    listGreases(),
    listEvidence({ greaseId }),
    settingsForUser(userId),
  ]);
  const self = greases.find((g) => g.id === greaseId);
  if (!self) throw new NotFoundError("No grease with this id.");
  return greases
    .filter((g) => g.id !== greaseId)
    .map((other) => ({
      other: { id: other.id, name: other.name, code: other.code },
      result: evaluateMix(profileOf(self), profileOf(other), { evidence }, settings),
    }));
}

/**
 * Records evidence about a pair. For a lab mixture test the verdict is the engine's judgement of the
 * results against the site's allowances; for a supplier statement it is what the statement says.
 */
export async function createEvidence(
  input: EvidenceInput,
  userId: string,
  documentId: number | null,
): Promise<EvidenceDto> {
  const [a, b] = await Promise.all([getGrease(input.greaseAId), getGrease(input.greaseBId)]);
  if (!a) throw new ValidationError({ greaseAId: ["No grease with this id."] });
  if (!b) throw new ValidationError({ greaseBId: ["No grease with this id."] });
  let verdict = input.verdict;
  let testData: string | null = null;
  if (input.kind === "lab_mixture_test") {
    const test: MixtureTestInput = {
      neatA: input.neatA ?? {},
      neatB: input.neatB ?? {},
      mixtures: (input.mixtures ?? []).map((m) => ({
        ratioA: m.ratioA,
        ratioB: 100 - m.ratioA,
        result: m.result,
      })),
    };
    const settings = await settingsForUser(userId);
    const judged = evaluateMixtureTest(test, settings);
    if (judged.verdict === "unknown") {
      throw new ValidationError({
        mixtures: [
          "Enter dropping point, worked penetration and storage change for every mixture and both neat greases.",
        ],
      });
    }
    verdict = judged.verdict;
    testData = JSON.stringify({ greaseAId: a.id, greaseBId: b.id, ...test });
  }
  const sequelize = getSequelize();
  const id = await sequelize.transaction(async (transaction) => {
    const [inserted] = await sequelize.query(
      `INSERT INTO grease_pair_evidence (grease_low_id, grease_high_id, kind, verdict, title, summary, test_data, document_id, recorded_by, recorded_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      {
        replacements: [
          Math.min(a.id, b.id),
          Math.max(a.id, b.id),
          input.kind,
          verdict,
          input.title,
          input.summary ?? null,
          testData,
          documentId,
          userId,
          new Date(),
        ],
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    await appendAudit(
      {
        event: "rules.evidence_recorded",
        actorId: userId,
        subjectType: "evidence",
        subjectId: Number(inserted),
        payload: { greases: [a.code, b.code], kind: input.kind, verdict, title: input.title, documentId },
      },
      transaction,
    );
    return inserted;
  });
  log("info", "evidence_recorded", { evidenceId: id, greases: [a.id, b.id], verdict, by: userId });
  const [dto] = await listEvidence({ id: Number(id) });
  return dto!;
}
