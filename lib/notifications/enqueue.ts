import "server-only";
import type { NotificationEvent } from "./events";

/** Placeholder until the mail queue lands: the event is accepted and nobody is written to yet. */
export async function enqueueNotifications(event: NotificationEvent): Promise<void> {
  void event;
}
