/**
 * Typed environment, validated once at start-up. A missing or bad variable stops the process
 * with a message naming it, instead of failing later somewhere deep.
 */
import { z } from "zod";

const bool = z
  .enum(["true", "false", "1", "0", ""])
  .optional()
  .transform((v) => v === "true" || v === "1");

const envSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  /** demo: seeded data, local SMTP stand-in, demo password shown on the sign-in page. */
  RIGLINE_MODE: z.enum(["production", "demo", "development", "test"]).default("development"),
  DATABASE_URL: z
    .string()
    .regex(/^(file:|libsql:|https?:|wss?:)/, {
      error: "DATABASE_URL must start with file:, libsql:, http(s): or ws(s):",
    })
    .default("file:./data/rigline.db"),
  DATABASE_AUTH_TOKEN: z.string().optional(),
  AUTH_SECRET: z.string().min(32, { error: "AUTH_SECRET must be at least 32 characters" }),
  APP_URL: z.url({ error: "APP_URL must be a full URL such as https://rigline.example" }).default(
    "http://localhost:3000",
  ),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: bool,
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default("Rigline <no-reply@rigline.example>"),
  /** Run the outbox sender inside the web process (default on). */
  OUTBOX_SENDER: z.enum(["on", "off"]).default("on"),
  OUTBOX_INTERVAL_MS: z.coerce.number().int().min(100).default(2000),
  STORAGE_DRIVER: z.enum(["disk", "s3"]).default("disk"),
  STORAGE_DIR: z.string().default("./data/files"),
  S3_ENDPOINT: z.string().optional(),
  S3_BUCKET: z.string().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map(
      (i) => `  ${i.path.join(".") || "(environment)"}: ${i.message}`,
    );
    throw new Error(`Rigline cannot start: bad environment variables\n${lines.join("\n")}`);
  }
  const env = parsed.data;
  if (env.STORAGE_DRIVER === "s3" && (!env.S3_BUCKET || !env.S3_ENDPOINT)) {
    throw new Error("Rigline cannot start: STORAGE_DRIVER=s3 needs S3_ENDPOINT and S3_BUCKET");
  }
  return env;
}

export function env(): Env {
  cached ??= readEnv();
  return cached;
}

/** The development-only mailbox and the demo password are never shown in production. */
export function isProduction(): boolean {
  return env().RIGLINE_MODE === "production";
}
