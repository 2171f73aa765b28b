import { config } from "@/lib/config";

/** Links in mail must work from any mail client, so they are absolute, from APP_BASE_URL. */
export function absoluteUrl(path: string): string {
  return new URL(path, config().APP_BASE_URL).toString();
}
