import { z } from "zod";
import { PASSWORD_MAX_LENGTH, passwordProblem } from "@/lib/domain/auth";
import { ROLES } from "@/lib/domain/permissions";

export const emailField = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(254, "An e-mail address has at most 254 characters.")
  .pipe(z.email("Enter a valid e-mail address."))
  .transform((v) => v.toLowerCase());

export const signInSchema = z.object({
  email: emailField,
  password: z
    .string({ error: "Enter your password." })
    .min(1, "Enter your password.")
    .max(PASSWORD_MAX_LENGTH * 4, "The password is too long."),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const newPasswordField = z
  .string({ error: "Enter a password." })
  .superRefine((value, ctx) => {
    const problem = passwordProblem(value);
    if (problem) ctx.addIssue({ code: "custom", message: problem });
  });

export const setPasswordSchema = z
  .object({
    token: z.string().min(10).max(200),
    password: newPasswordField,
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ." });

export const roleField = z.enum(ROLES, { error: "Choose one of the roles." });

export const inviteUserSchema = z.object({
  email: emailField,
  name: z.string().trim().min(1, "Enter the person's name.").max(120, "At most 120 characters."),
  role: roleField,
  siteIds: z.array(z.coerce.number().int().positive()).max(100).default([]),
});
export type InviteUserInput = z.infer<typeof inviteUserSchema>;

export const changeRoleSchema = z.object({ userId: z.string().min(1).max(36), role: roleField });
export const siteAccessSchema = z.object({
  userId: z.string().min(1).max(36),
  siteIds: z.array(z.coerce.number().int().positive()).max(100),
});
export const userIdSchema = z.object({ userId: z.string().min(1).max(36) });
