import { z } from "zod";

/**
 * Configuration, parsed once from the environment. Every variable is documented in `.env.example`.
 * Kept free of Next.js imports so scripts (migrations, seed) can use it too.
 */
const boolish = z
  .enum(["true", "false", "1", "0", "on", "off", "yes", "no"])
  .transform((v) => ["true", "1", "on", "yes"].includes(v));

const port = z.coerce.number().int().min(1).max(65535);

export const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  APP_URL: z.url({ protocol: /^https?$/ }).default("http://localhost:3000"),
  DATABASE_HOST: z.string().min(1).default("127.0.0.1"),
  DATABASE_PORT: port.default(3307),
  DATABASE_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]{1,64}$/, "letters, digits and _ only")
    .default("greaseledger"),
  DATABASE_USER: z.string().min(1).default("app"),
  DATABASE_PASSWORD: z.string().min(1),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(200).default(20),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: port.default(2525),
  SMTP_SECURE: boolish.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Greaseledger <noreply@greaseledger.invalid>"),
  MAIL_INBOX_URL: z.url().optional(),
  COOKIE_SECURE: z.enum(["auto", "true", "false"]).default("auto"),
  OUTBOX_RELAY: boolish.default(true),
  OUTBOX_POLL_MS: z.coerce.number().int().min(100).max(600_000).default(2000),
  TRUST_PROXY: boolish.default(false),
  UPLOAD_DIR: z.string().min(1).default(".data/uploads"),
});

export type Env = z.infer<typeof envSchema>;

export class EnvError extends Error {
  constructor(public readonly variables: Record<string, string>) {
    super(
      "Invalid environment: " +
        Object.entries(variables)
          .map(([name, problem]) => `${name}: ${problem}`)
          .join("; "),
    );
    this.name = "EnvError";
  }
}

/** Parses a raw environment. Throws EnvError naming every bad variable. Empty strings count as unset. */
export function parseEnv(raw: Record<string, string | undefined>): Env {
  const cleaned: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw)) {
    if (value !== undefined && value !== "") cleaned[key] = value;
  }
  const result = envSchema.safeParse(cleaned);
  if (!result.success) {
    const variables: Record<string, string> = {};
    for (const issue of result.error.issues) {
      const name = String(issue.path[0] ?? "environment");
      variables[name] ??= issue.message;
    }
    throw new EnvError(variables);
  }
  return result.data;
}

let cached: Env | undefined;

/** The process environment, parsed on first use. */
export function getEnv(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** Whether cookies get `Secure` and the `__Host-` prefix. */
export function cookiesAreSecure(env: Env): boolean {
  if (env.COOKIE_SECURE === "auto") return env.APP_URL.startsWith("https:");
  return env.COOKIE_SECURE === "true";
}
