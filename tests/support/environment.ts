import { assertLoopbackDatabase } from "@/lib/db/loopback";

/** The settings `npm test` hands to every suite; suites that need services read them here. */
export function testEnvironment() {
  const databaseUrl = process.env.DATABASE_URL;
  const baseUrl = process.env.APP_BASE_URL;
  if (!process.env.HOEBENCH_TEST || !databaseUrl || !baseUrl) {
    throw new Error("run the tests through `npm test`, which starts the test database and services");
  }
  assertLoopbackDatabase(databaseUrl);
  return { databaseUrl, baseUrl, mailCatcherUrl: process.env.MAIL_CATCHER_URL ?? "" };
}
