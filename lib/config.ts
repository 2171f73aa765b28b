import { z } from "zod";

const DEVELOPMENT_SECRET = "hoebench-local-development-secret";

/**
 * Every setting the app reads from its environment, validated once. Defaults match the
 * services `npm start` runs on loopback; production sets them all explicitly.
 */
const configSchema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z.url().default("postgres://postgres@127.0.0.1:54329/hoebench"),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  APP_BASE_URL: z.url().default("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(16).default(DEVELOPMENT_SECRET),
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
  /** next-auth's own address for its callbacks; the app's links use APP_BASE_URL. */
  NEXTAUTH_URL: z.url().optional(),
  /**
   * Proxies in front of the app whose X-Forwarded-For entries are believed (0: none, the
   * client's own address counts; 1: one load balancer). Read where connections arrive
   * (scripts/client-address.cjs); rate limits per address depend on it.
   */
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(5).default(0),
});

/** Settings production must give itself: the development fallbacks would let anyone sign session cookies, and mail links would point at loopback. */
function productionProblems(env: Record<string, string | undefined>): string[] {
  if (env.NODE_ENV !== "production") return [];
  const problems: string[] = [];
  if (!env.NEXTAUTH_SECRET || env.NEXTAUTH_SECRET === DEVELOPMENT_SECRET) problems.push("NEXTAUTH_SECRET: must be set in production");
  if (!env.APP_BASE_URL) problems.push("APP_BASE_URL: must be set in production");
  return problems;
}

export type AppConfig = z.infer<typeof configSchema>;

let cached: AppConfig | undefined;

function readConfig(env: Record<string, string | undefined>): AppConfig {
  const parsed = configSchema.safeParse(env);
  const problems = [...(parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`)), ...productionProblems(env)];
  if (problems.length > 0 || !parsed.success) throw new Error(`invalid configuration: ${problems.join("; ")}`);
  return parsed.data;
}

export function config(): AppConfig {
  cached ??= readConfig(process.env);
  return cached;
}

/** Validates settings other than this process's own (start scripts, tests); throws naming each bad one. */
export function parseConfig(env: Record<string, string | undefined>): AppConfig {
  return readConfig(env);
}
