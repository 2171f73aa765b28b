import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

export const projectRoot = path.resolve(__dirname, "../..");
export const stateRoot = path.join(projectRoot, ".hoebench");
export const POSTGRES_PORT = Number(process.env.HOEBENCH_PG_PORT ?? 54329);

export type Mode = "start" | "dev" | "test";

export interface Ports {
  app: number;
  s3: number;
  smtp: number;
  mailHttp: number;
}

/**
 * Tests use their own ports, database and build folder, so `npm test` can run beside
 * `npm start`; HOEBENCH_TEST_SLOT=N gives a further, separate set for a second test run.
 */
export const testSlot = Number(process.env.HOEBENCH_TEST_SLOT ?? 0);
const slotSuffix = testSlot ? `_${testSlot}` : "";

export const portsFor = (mode: Mode): Ports => {
  if (mode !== "test") return { app: 3000, s3: 4569, smtp: 2525, mailHttp: 2526 };
  const offset = testSlot * 10;
  return { app: 3100 + offset, s3: 4579 + offset, smtp: 2535 + offset, mailHttp: 2536 + offset };
};

export const databaseFor = (mode: Mode) => (mode === "test" ? `hoebench_test${slotSuffix}` : "hoebench");
export const testStateName = (name: string) => `${name}${slotSuffix.replace("_", "-")}`;

/** A per-checkout secret, made once, so sessions survive restarts without a committed key. */
function sessionSecret(): string {
  const file = path.join(stateRoot, "session-secret");
  if (!existsSync(file)) {
    mkdirSync(stateRoot, { recursive: true });
    writeFileSync(file, randomBytes(32).toString("hex"), { mode: 0o600 });
  }
  return readFileSync(file, "utf8").trim();
}

export function appEnvironment(mode: Mode, database = databaseFor(mode)): Record<string, string> {
  const ports = portsFor(mode);
  const base = `http://127.0.0.1:${ports.app}`;
  return {
    DATABASE_URL: `postgres://postgres@127.0.0.1:${POSTGRES_PORT}/${database}`,
    APP_BASE_URL: base,
    NEXTAUTH_URL: base,
    NEXTAUTH_SECRET: sessionSecret(),
    S3_ENDPOINT: `http://127.0.0.1:${ports.s3}`,
    S3_BUCKET: mode === "test" ? "hoebench-test" : "hoebench",
    S3_ACCESS_KEY_ID: "S3RVER",
    S3_SECRET_ACCESS_KEY: "S3RVER",
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: String(ports.smtp),
    MAIL_CATCHER_URL: `http://127.0.0.1:${ports.mailHttp}`,
    NEXT_TELEMETRY_DISABLED: "1",
    NEXT_DIST_DIR: mode === "test" ? testStateName(".next-test") : ".next",
    // Test clients play the proxy in front of the app: the address they forward is believed.
    ...(mode === "test" ? { TRUSTED_PROXY_HOPS: "1" } : {}),
  };
}
