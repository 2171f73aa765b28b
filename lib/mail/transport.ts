import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { config } from "@/lib/config";

const globalForMail = globalThis as unknown as { hoebenchMail?: Transporter };

/** SMTP settings alone decide where mail goes: the local catcher or a real relay. */
export function mailTransport(): Transporter {
  if (!globalForMail.hoebenchMail) {
    const settings = config();
    globalForMail.hoebenchMail = nodemailer.createTransport({
      host: settings.SMTP_HOST,
      port: settings.SMTP_PORT,
      secure: settings.SMTP_SECURE,
      ignoreTLS: !settings.SMTP_SECURE && settings.SMTP_HOST === "127.0.0.1",
      auth: settings.SMTP_USER ? { user: settings.SMTP_USER, pass: settings.SMTP_PASSWORD ?? "" } : undefined,
      connectionTimeout: 3000,
      greetingTimeout: 3000,
    });
  }
  return globalForMail.hoebenchMail;
}

export async function mailReachable(): Promise<boolean> {
  try {
    await mailTransport().verify();
    return true;
  } catch {
    return false;
  }
}
