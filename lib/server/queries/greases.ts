import "server-only";
import { Op, type Transaction } from "sequelize";
import type { GreaseProfile } from "@/lib/domain/compatibility";
import type {
  BaseOilType,
  FoodGrade,
  NlgiGrade,
  PackKind,
  SolidAdditive,
  Thickener,
} from "@/lib/domain/catalogue";
import type { Grease, GreaseDocument, GreasePack, StoredDocument } from "@/models";
import { greaseSchema, type GreaseInput, type GreasePatch } from "@/lib/validation/grease";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { appendAudit } from "../audit";
import type { BatchStatement } from "../batch";
import { boundModels, getSequelize } from "../db";
import { ConflictError, NotFoundError, ValidationError } from "../errors";
import { log } from "../log";

export interface PackDto {
  id: number;
  kind: PackKind;
  netMassGrams: number;
  label?: string;
}

export interface GreaseDocumentDto {
  kind: "sds" | "tds";
  documentId: number;
  originalName: string;
  sizeBytes: number;
  uploadedAt: string;
}

/** A grease as the public API shows it (API.md `Grease`), with a few extra fields. */
export interface GreaseDto {
  id: number;
  code: string;
  name: string;
  supplier: string;
  thickener: Thickener;
  baseOilType: BaseOilType;
  viscosity40: number;
  viscosity100?: number;
  nlgiGrade: NlgiGrade;
  workedPenetration?: number;
  isoVg?: number;
  droppingPointC?: number;
  minTemperatureC?: number;
  maxTemperatureC?: number;
  foodGrade: FoodGrade;
  solidAdditives: SolidAdditive[];
  shelfLifeMonths?: number;
  notes?: string;
  version: number;
  packs: PackDto[];
  updatedAt: string;
}

const num = (v: string | number | null | undefined) =>
  v === null || v === undefined ? undefined : Number(v);
const opt = <T>(v: T | null | undefined) => (v === null || v === undefined ? undefined : v);

/** The solid additives as stored (comma-separated) to a list. */
const additivesOf = (stored: string | null | undefined): SolidAdditive[] =>
  stored ? (stored.split(",").filter(Boolean) as SolidAdditive[]) : [];

function toDto(g: Grease, supplierName: string, packs: GreasePack[]): GreaseDto {
  return {
    id: g.id,
    code: g.code,
    name: g.name,
    supplier: supplierName,
    thickener: g.thickener,
    baseOilType: g.baseOilType,
    viscosity40: Number(g.viscosity40),
    viscosity100: num(g.viscosity100),
    nlgiGrade: g.nlgiGrade,
    workedPenetration: opt(g.workedPenetration),
    isoVg: opt(g.isoVg),
    droppingPointC: opt(g.droppingPointC),
    minTemperatureC: opt(g.minTemperatureC),
    maxTemperatureC: opt(g.maxTemperatureC),
    foodGrade: g.foodGrade,
    solidAdditives: additivesOf(g.solidAdditives),
    shelfLifeMonths: opt(g.shelfLifeMonths),
    notes: opt(g.notes),
    version: g.version,
    packs: packs
      .filter((p) => p.greaseId === g.id)
      .sort((a, b) => a.netMassGrams - b.netMassGrams)
      .map((p) => ({
        id: p.id,
        kind: p.kind,
        netMassGrams: p.netMassGrams,
        ...(p.label ? { label: p.label } : {}),
      })),
    updatedAt: new Date(g.updatedAt).toISOString(),
  };
}

/** Every grease with its supplier and packs, by name (two statements, whatever the number of greases). */
export async function listGreases(): Promise<GreaseDto[]> {
  const { Grease, GreasePack, Supplier } = boundModels();
  const greases = await Grease.findAll({
    include: [{ model: Supplier, as: "supplier", attributes: ["name"] }],
    order: [["name", "ASC"]],
  });
  const packs = await GreasePack.findAll();
  return greases.map((g) => toDto(g, g.supplier?.name ?? "", packs));
}

export async function getGrease(id: number, transaction?: Transaction): Promise<GreaseDto | null> {
  const { Grease, GreasePack, Supplier } = boundModels();
  const grease = await Grease.findByPk(id, {
    include: [{ model: Supplier, as: "supplier", attributes: ["name"] }],
    transaction,
  });
  if (!grease) return null;
  const packs = await GreasePack.findAll({ where: { greaseId: id }, transaction });
  return toDto(grease, grease.supplier?.name ?? "", packs);
}

type ProfileRow = {
  id: number;
  name: string;
  thickener: Thickener;
  base_oil_type: BaseOilType;
  viscosity_40: string | number;
  nlgi_grade: NlgiGrade;
  food_grade: FoodGrade;
  solid_additives: string;
};

/** The compatibility profiles of some greases, by id (the engine needs nothing else), as a statement for a caller that
 * sends it with others (ids must not be empty); `profilesFromRows` reads its rows. */
export function greaseProfilesStatement(ids: number[]): BatchStatement {
  return {
    sql: "SELECT id, name, thickener, base_oil_type, viscosity_40, nlgi_grade, food_grade, solid_additives FROM grease WHERE id IN (?)",
    params: [[...new Set(ids)]],
  };
}

export function profilesFromRows(rows: unknown[]): Map<number, GreaseProfile> {
  return new Map(
    (rows as ProfileRow[]).map((g) => [
      Number(g.id),
      {
        productId: Number(g.id),
        name: g.name,
        thickener: g.thickener,
        baseOilType: g.base_oil_type,
        viscosity40: Number(g.viscosity_40),
        nlgiGrade: g.nlgi_grade,
        foodGrade: g.food_grade,
        solidAdditives: additivesOf(g.solid_additives),
      },
    ]),
  );
}

export async function requireGrease(id: number): Promise<GreaseDto> {
  const grease = await getGrease(id);
  if (!grease) throw new NotFoundError("No grease with this id.");
  return grease;
}

export async function listGreaseDocuments(greaseId: number): Promise<GreaseDocumentDto[]> {
  const { GreaseDocument, StoredDocument } = boundModels();
  const rows = await GreaseDocument.findAll({
    where: { greaseId },
    include: [{ model: StoredDocument, as: "document" }],
  });
  return rows.map((r) => {
    const doc = (r as GreaseDocument & { document: StoredDocument }).document;
    return {
      kind: r.kind,
      documentId: r.documentId,
      originalName: doc.originalName,
      sizeBytes: doc.sizeBytes,
      uploadedAt: new Date(doc.uploadedAt).toISOString(),
    };
  });
}

async function supplierId(name: string, transaction: Transaction, now: Date): Promise<number> {
  const { Supplier } = boundModels();
  const [supplier] = await Supplier.findOrCreate({
    where: { name },
    defaults: {
      name,
      contactName: null,
      contactEmail: null,
      leadTimeDays: null,
      createdAt: now,
      updatedAt: now,
    },
    transaction,
  });
  return supplier.id;
}

function columns(input: GreaseInput) {
  return {
    code: input.code,
    name: input.name,
    thickener: input.thickener,
    baseOilType: input.baseOilType,
    viscosity40: input.viscosity40,
    viscosity100: input.viscosity100 ?? null,
    nlgiGrade: input.nlgiGrade,
    workedPenetration: input.workedPenetration ?? null,
    isoVg: input.isoVg ?? null,
    droppingPointC: input.droppingPointC ?? null,
    minTemperatureC: input.minTemperatureC ?? null,
    maxTemperatureC: input.maxTemperatureC ?? null,
    foodGrade: input.foodGrade,
    solidAdditives: input.solidAdditives.join(","),
    shelfLifeMonths: input.shelfLifeMonths ?? null,
    notes: input.notes ?? null,
  };
}

function isDuplicateCode(error: unknown) {
  return (error as { name?: string }).name === "SequelizeUniqueConstraintError";
}

/** Inserts one grease and its packs inside a transaction the caller owns. */
export async function insertGrease(
  input: GreaseInput,
  userId: string | null,
  transaction: Transaction,
  now = new Date(),
): Promise<number> {
  const { Grease, GreasePack } = boundModels();
  const grease = await Grease.create(
    {
      ...columns(input),
      supplierId: await supplierId(input.supplier, transaction, now),
      createdBy: userId,
      updatedBy: userId,
    },
    { transaction },
  );
  for (const pack of input.packs) {
    await GreasePack.create(
      { greaseId: grease.id, kind: pack.kind, netMassGrams: pack.netMassGrams, label: pack.label ?? null },
      { transaction },
    );
  }
  return grease.id;
}

export async function createGrease(input: GreaseInput, userId: string | null): Promise<GreaseDto> {
  try {
    const id = await getSequelize().transaction(async (t) => {
      const created = await insertGrease(input, userId, t);
      await appendAudit(
        {
          event: "catalogue.grease_created",
          actorId: userId,
          subjectType: "grease",
          subjectId: created,
          payload: { code: input.code, name: input.name },
        },
        t,
      );
      return created;
    });
    log("info", "grease_created", { greaseId: id, code: input.code, by: userId });
    return (await getGrease(id))!;
  } catch (error) {
    if (isDuplicateCode(error))
      throw new ValidationError({ code: ["Another grease already has this code."] });
    throw error;
  }
}

/**
 * Applies a partial change. The merged grease is validated as a whole (so cross-field rules hold);
 * a stale `version` gives 409. Packs, when given, are the full new list: packs with an id are kept or
 * changed, packs without an id are added, packs not listed are removed.
 */
export async function updateGrease(
  id: number,
  patch: GreasePatch,
  userId: string | null,
): Promise<GreaseDto> {
  const { Grease, GreasePack } = boundModels();
  const sequelize = getSequelize();
  try {
    await sequelize.transaction(async (transaction) => {
      const current = await getGrease(id, transaction);
      if (!current) throw new NotFoundError("No grease with this id.");
      await Grease.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      const { version, ...changes } = patch;
      if (version !== undefined && version !== current.version) {
        throw new ConflictError(
          "stale_version",
          "Someone else changed this grease since you opened it. Reload and apply your change again.",
        );
      }
      const merged = greaseSchema.safeParse({ ...current, ...changes });
      if (!merged.success) throw new ValidationError(zodFieldErrors(merged.error));
      const input = merged.data;
      if (changes.packs) {
        const keep = new Set(changes.packs.map((p) => p.id).filter((v): v is number => v !== undefined));
        const unknown = [...keep].filter((packId) => !current.packs.some((p) => p.id === packId));
        if (unknown.length)
          throw new ValidationError({
            packs: [`Pack ${unknown.join(", ")} does not belong to this grease.`],
          });
        await GreasePack.destroy({ where: { greaseId: id, id: { [Op.notIn]: [...keep, 0] } }, transaction });
        for (const pack of changes.packs) {
          const values = { kind: pack.kind, netMassGrams: pack.netMassGrams, label: pack.label ?? null };
          if (pack.id) await GreasePack.update(values, { where: { id: pack.id, greaseId: id }, transaction });
          else await GreasePack.create({ greaseId: id, ...values }, { transaction });
        }
      }
      await Grease.update(
        {
          ...columns(input),
          supplierId: await supplierId(input.supplier, transaction, new Date()),
          updatedBy: userId,
          version: current.version + 1,
        },
        { where: { id }, transaction },
      );
      await appendAudit(
        {
          event: "catalogue.grease_updated",
          actorId: userId,
          subjectType: "grease",
          subjectId: id,
          payload: { code: input.code, changes },
        },
        transaction,
      );
    });
  } catch (error) {
    if (isDuplicateCode(error))
      throw new ValidationError({ code: ["Another grease already has this code."] });
    throw error;
  }
  log("info", "grease_updated", { greaseId: id, by: userId, fields: Object.keys(patch) });
  return (await getGrease(id))!;
}

/** Codes already in the catalogue, for the import preview. */
export async function existingGreaseCodes(codes: string[]): Promise<Set<string>> {
  const { Grease } = boundModels();
  if (!codes.length) return new Set();
  const rows = await Grease.findAll({ attributes: ["code"], where: { code: { [Op.in]: codes } } });
  return new Set(rows.map((r) => r.code.toLowerCase()));
}

/** Sets (or replaces) the safety or technical data sheet of a grease. */
export async function setGreaseDocument(
  greaseId: number,
  kind: "sds" | "tds",
  documentId: number,
  userId: string | null = null,
): Promise<void> {
  const { GreaseDocument } = boundModels();
  await requireGrease(greaseId);
  await getSequelize().transaction(async (transaction) => {
    await GreaseDocument.destroy({ where: { greaseId, kind }, transaction });
    await GreaseDocument.create({ greaseId, kind, documentId }, { transaction });
    await appendAudit(
      {
        event: "catalogue.document_set",
        actorId: userId,
        subjectType: "grease",
        subjectId: greaseId,
        payload: { kind, documentId },
      },
      transaction,
    );
  });
  log("info", "grease_document_set", { greaseId, kind, documentId });
}

export async function listSupplierNames(): Promise<string[]> {
  const { Supplier } = boundModels();
  const rows = await Supplier.findAll({ attributes: ["name"], order: [["name", "ASC"]] });
  return rows.map((r) => r.name);
}

/** Inserts many greases in one transaction: all of them, or none when any fails. */
export async function importGreases(inputs: GreaseInput[], userId: string | null): Promise<number> {
  try {
    await getSequelize().transaction(async (t) => {
      for (const input of inputs) await insertGrease(input, userId, t);
      await appendAudit(
        {
          event: "catalogue.imported",
          actorId: userId,
          subjectType: "grease",
          payload: { count: inputs.length, codes: inputs.map((i) => i.code) },
        },
        t,
      );
    });
  } catch (error) {
    if (isDuplicateCode(error))
      throw new ConflictError(
        "duplicate_code",
        "A code in the file was added by someone else meanwhile. Preview again.",
      );
    throw error;
  }
  log("info", "greases_imported", { count: inputs.length, by: userId });
  return inputs.length;
}
