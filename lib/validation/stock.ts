import { z } from "zod";

const isoDate = (label: string) =>
  z.preprocess(
    (v) => (v === "" || v === null ? undefined : v),
    z.string({ error: `${label} must be a date (YYYY-MM-DD).` }).regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD).`).refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), `${label} is not a real date.`).optional(),
  );

export const receiptSchema = z.object({
  greaseId: z.number({ error: "greaseId must be a number." }).int().positive(),
  packId: z.number({ error: "packId must be a number." }).int().positive(),
  quantity: z.number({ error: "quantity must be a whole number of containers." }).int("quantity must be a whole number of containers.").min(1, "quantity must be at least 1.").max(100_000, "quantity must be at most 100000."),
  lotNumber: z.string({ error: "Enter the lot number from the label." }).trim().min(1, "Enter the lot number from the label.").max(60, "At most 60 characters."),
  manufacturedOn: isoDate("manufacturedOn"),
  expiresOn: isoDate("expiresOn"),
  location: z.string().trim().min(1).max(16).optional(),
  purchaseRequestId: z.number().int().positive().optional(),
});
export type ReceiptInput = z.infer<typeof receiptSchema>;

export const issueSchema = z.object({
  greaseId: z.number({ error: "greaseId must be a number." }).int().positive(),
  packId: z.number({ error: "packId must be a number." }).int().positive(),
  quantity: z.number({ error: "quantity must be a whole number of containers." }).int("quantity must be a whole number of containers.").min(1, "quantity must be at least 1.").max(10_000, "quantity must be at most 10000."),
  location: z.string().trim().min(1).max(16).optional(),
  pointTag: z.string().min(8).max(10).optional(),
});
export type IssueInput = z.infer<typeof issueSchema>;
