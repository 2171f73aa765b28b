import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import type { NotificationEvent } from "./events";

/**
 * Reports an event for notification. It never throws and never waits for mail.
 *
 * Pass the action's `transaction` (before it commits) so the notice is queued atomically
 * with the action: a crash between the action's commit and a later queueing would lose the
 * notice. The queueing runs in a savepoint, so a failure there is rolled back on its own and
 * the action still commits, without its notice. Without a transaction the action has already
 * committed and the notice is queued on its own.
 */
export async function notify(event: NotificationEvent, options: { transaction?: Transaction } = {}): Promise<void> {
  const { transaction } = options;
  try {
    const { enqueueNotifications } = await import("./enqueue");
    if (!transaction) {
      await enqueueNotifications(event);
      return;
    }
    const outcomes = await db().transaction({ transaction }, (savepoint) => enqueueNotifications(event, { transaction: savepoint }));
    // Before the commit the worker could not see the rows; afterwards it can send them at once.
    if ([...outcomes.values()].includes("queued")) transaction.afterCommit(() => wakeMailWorker());
  } catch (error) {
    console.error("notification could not be queued", event.type, error);
  }
}
