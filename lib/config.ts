import { z } from "zod";

/**
 * Every setting the app reads from its environment, validated once. Defaults match the
 * services `npm start` runs on loopback; production sets them all explicitly.
 */
const configSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.url().default("postgres://postgres@127.0.0.1:54329/hoebench"),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  APP_BASE_URL: z.url().default("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16).default("hoebench-local-development-secret"),
  S3_ENDPOINT: z.url().default("http://127.0.0.1:4569"),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("hoebench"),
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  S3_FORCE_PATH_STYLE: z.stringbool().default(true),
  SMTP_HOST: z.string().min(1).default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  SMTP_SECURE: z.stringbool().default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().min(3).default("Hoebench <no-reply@hoebench.test>"),
  /** Only the local catcher has one; the in-app mail page exists only when it is set. */
  MAIL_CATCHER_URL: z.url().optional(),
});

export type AppConfig = z.infer<typeof configSchema>;

let cached: AppConfig | undefined;

export function config(): AppConfig {
  if (!cached) {
    const parsed = configSchema.safeParse(process.env);
    if (!parsed.success) {
      const problems = parsed.error.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`).join("; ");
      throw new Error(`invalid configuration: ${problems}`);
    }
    cached = parsed.data;
  }
  return cached;
}

export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  return configSchema.parse(env);
}
