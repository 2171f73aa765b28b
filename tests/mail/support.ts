import net from "node:net";
import nodemailer from "nodemailer";
import { testEnvironment } from "../support/environment";

export interface CaughtMail {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

/** Everything the slot's SMTP catcher holds, newest first. */
export async function caught(): Promise<CaughtMail[]> {
  const response = await fetch(new URL("/messages", testEnvironment().mailCatcherUrl));
  if (!response.ok) throw new Error(`mail catcher answered ${response.status}`);
  return (await response.json()) as CaughtMail[];
}

/** Waits until mail matching `match` reaches the catcher (sent by the app's worker or a test). */
export async function waitForMail(match: (mail: CaughtMail) => boolean, timeoutMs = 15_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await caught()).find(match);
    if (found) return found;
    if (Date.now() > deadline) throw new Error("the expected mail did not arrive at the catcher");
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

export const mailTo = (address: string, subjectPart = "") => (mail: CaughtMail) =>
  mail.to.includes(address) && mail.subject.includes(subjectPart);

/** The first link in the mail's text whose path starts with `pathPrefix`. */
export function linkIn(mail: CaughtMail, pathPrefix: string): URL {
  const urls = mail.text.match(/https?:\/\/\S+/g) ?? [];
  const found = urls.map((url) => new URL(url)).find((url) => url.pathname.startsWith(pathPrefix));
  if (!found) throw new Error(`no ${pathPrefix} link in the mail`);
  return found;
}

/** A loopback port nobody listens on: a stand-in for a mail catcher that is down. */
export async function deadPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", () => resolve()));
  const { port } = server.address() as net.AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

export async function deadTransport() {
  return nodemailer.createTransport({ host: "127.0.0.1", port: await deadPort(), ignoreTLS: true, connectionTimeout: 1000, greetingTimeout: 1000 });
}

export function uniqueAddress(label: string): string {
  return `${label}-${Math.random().toString(36).slice(2, 10)}@example.test`;
}
