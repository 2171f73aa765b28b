import "server-only";
import { z } from "zod";
import { config } from "@/lib/config";

const caughtMailSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;

/** Mail held by the local catcher; null when this deployment sends through a real relay. */
export async function caughtMail(): Promise<CaughtMail[] | null> {
  const url = config().MAIL_CATCHER_URL;
  if (!url) return null;
  const response = await fetch(new URL("/messages", url), { cache: "no-store", signal: AbortSignal.timeout(3000) });
  if (!response.ok) throw new Error(`mail catcher answered ${response.status}`);
  return z.array(caughtMailSchema).parse(await response.json());
}
