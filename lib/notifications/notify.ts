import "server-only";
import type { NotificationEvent } from "./events";

/**
 * Reports an event for notification. It never throws and never waits for mail: the action
 * that triggered it has already succeeded and must stay so.
 */
export async function notify(event: NotificationEvent): Promise<void> {
  try {
    const { enqueueNotifications } = await import("./enqueue");
    await enqueueNotifications(event);
  } catch (error) {
    console.error("notification could not be queued", event.type, error);
  }
}
