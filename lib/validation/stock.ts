import { z } from "zod";
import { normaliseTagCode } from "@/lib/domain/service";
import { optionalNumber, optionalText, requiredNumber } from "./fields";

const isoDate = (label: string) =>
  z.preprocess(
    (v) => (v === "" || v === null ? undefined : v),
    z
      .string({ error: `${label} must be a date (YYYY-MM-DD).` })
      .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD).`)
      .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), `${label} is not a real date.`)
      .optional(),
  );

export const receiptSchema = z.object({
  greaseId: z.number({ error: "greaseId must be a number." }).int().positive(),
  packId: z.number({ error: "packId must be a number." }).int().positive(),
  quantity: z
    .number({ error: "quantity must be a whole number of containers." })
    .int("quantity must be a whole number of containers.")
    .min(1, "quantity must be at least 1.")
    .max(100_000, "quantity must be at most 100000."),
  lotNumber: z
    .string({ error: "Enter the lot number from the label." })
    .trim()
    .min(1, "Enter the lot number from the label.")
    .max(60, "At most 60 characters."),
  manufacturedOn: isoDate("manufacturedOn"),
  expiresOn: isoDate("expiresOn"),
  location: z
    .string({ error: "location must be a storage location code." })
    .trim()
    .min(1, "location must not be empty.")
    .max(40, "At most 40 characters.")
    .optional(),
  purchaseRequestId: z.number().int().positive().optional(),
});
export type ReceiptInput = z.infer<typeof receiptSchema>;

export const issueSchema = z.object({
  greaseId: z.number({ error: "greaseId must be a number." }).int().positive(),
  packId: z.number({ error: "packId must be a number." }).int().positive(),
  quantity: z
    .number({ error: "quantity must be a whole number of containers." })
    .int("quantity must be a whole number of containers.")
    .min(1, "quantity must be at least 1.")
    .max(10_000, "quantity must be at most 10000."),
  location: z
    .string({ error: "location must be a storage location code." })
    .trim()
    .min(1, "location must not be empty.")
    .max(40, "At most 40 characters.")
    .optional(),
  pointTag: z.string().min(8).max(10).optional(),
});
export type IssueInput = z.infer<typeof issueSchema>;

/** A container label's code: 8 characters, typed or read from its QR code. */
export const labelCodeSchema = z.preprocess(
  (v) => (typeof v === "string" ? (normaliseTagCode(v) ?? v) : v),
  z
    .string({ error: "Scan the container label or type its 8-character code." })
    .regex(/^[0-9A-HJKMNP-TV-Z]{8}$/, "A label code is 8 letters and digits, as printed under the QR code."),
);

const locationCode = (label: string) =>
  z
    .string({ error: `Choose the ${label}.` })
    .trim()
    .min(1, `Choose the ${label}.`)
    .max(40, "At most 40 characters.");
const containers = (label: string, max = 100_000) => requiredNumber(label, 1, max, { int: true });
const reasonText = (what: string) =>
  z
    .string({ error: `Give the reason for the ${what}.` })
    .trim()
    .min(3, `Give the reason for the ${what} (at least 3 characters).`)
    .max(300, "At most 300 characters.");
const formKey = z.string().trim().min(1).max(255).optional();

/** The clerk's receiving form (strings from a form; the delivery note is checked separately). */
export const receiptFormSchema = z.object({
  greaseId: requiredNumber("Grease", 1, 1e9, { int: true }),
  packId: requiredNumber("Pack", 1, 1e9, { int: true }),
  quantity: containers("Containers received"),
  lotNumber: z
    .string({ error: "Enter the lot number from the label." })
    .trim()
    .min(1, "Enter the lot number from the label.")
    .max(60, "At most 60 characters."),
  manufacturedOn: isoDate("Manufactured on"),
  expiresOn: isoDate("Expires on"),
  location: locationCode("storage location"),
  purchaseRequestId: optionalNumber("Purchase request", 1, 1e9, { int: true }),
  idempotencyKey: formKey,
});

export const issueLiveSchema = issueSchema.extend({
  lotLabel: labelCodeSchema.optional(),
  issuedToUserId: z.string().uuid("Choose who takes the containers.").optional(),
});
export type IssueLiveInput = z.infer<typeof issueLiveSchema>;

export const returnSchema = z.object({
  labelCode: labelCodeSchema,
  location: locationCode("location the containers go back to"),
  quantity: containers("Quantity (containers)", 10_000),
  reason: optionalText(300),
  idempotencyKey: formKey,
});
export type ReturnInput = z.infer<typeof returnSchema>;

export const transferSchema = z
  .object({
    labelCode: labelCodeSchema,
    fromLocation: locationCode("location to take from"),
    toLocation: locationCode("location to move to"),
    quantity: containers("Quantity (containers)", 100_000),
    idempotencyKey: formKey,
  })
  .refine((v) => v.fromLocation !== v.toLocation, {
    path: ["toLocation"],
    message: "Choose another location than the one the containers are in.",
  });
export type TransferInput = z.infer<typeof transferSchema>;

export const scrapSchema = z.object({
  labelCode: labelCodeSchema,
  location: locationCode("location"),
  quantity: containers("Quantity (containers)", 100_000),
  reason: reasonText("scrap"),
  idempotencyKey: formKey,
});
export type ScrapInput = z.infer<typeof scrapSchema>;

/** A cycle count: what the system expected when the sheet was shown, and what was counted. */
export const countSchema = z.object({
  location: locationCode("location counted"),
  lines: z
    .array(
      z.object({
        lotId: z.coerce.number().int().positive(),
        expected: z.coerce.number().int().min(0),
        counted: requiredNumber("Counted", 0, 100_000, { int: true }),
      }),
    )
    .min(1, "There is nothing to count at this location."),
  reason: optionalText(300),
  idempotencyKey: formKey,
});
export type CountInput = z.infer<typeof countSchema>;

export const purchaseRequestUpdateSchema = z.object({
  id: requiredNumber("Purchase request", 1, 1e9, { int: true }),
  state: z.enum(["ordered", "cancelled"], { error: "Choose ordered or cancelled." }),
  reference: optionalText(60),
});

export const stockPolicySchema = z.object({
  siteId: requiredNumber("Site", 1, 1e9, { int: true }),
  greaseId: requiredNumber("Grease", 1, 1e9, { int: true }),
  reorderPointKg: optionalNumber("Fixed reorder point (kg)", 0, 100_000),
  safetyStockWeeks: optionalNumber("Safety stock (weeks)", 0, 52),
});

export const lotsQuerySchema = z.object({
  greaseId: z.coerce.number({ error: "greaseId must be a number." }).int().positive(),
  packId: z.coerce.number({ error: "packId must be a number." }).int().positive().optional(),
  location: z
    .string({ error: "location must be a storage location code." })
    .trim()
    .min(1, "location must not be empty.")
    .max(40, "At most 40 characters.")
    .optional(),
});
