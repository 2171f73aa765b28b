import { route } from "@/lib/auth/guard";
import { notificationPreferencesFor } from "@/lib/data/notification-settings";
import { jsonResponse } from "@/lib/http";
import { saveNotificationPreferences } from "@/lib/notifications/settings";
import { notificationSettingsSchema } from "@/lib/validations/notification-settings";

export const dynamic = "force-dynamic";

export const GET = route({ permission: "notifications:manage-own" }, async ({ user }) =>
  jsonResponse(notificationSettingsSchema, await notificationPreferencesFor(user.id)),
);

export const PUT = route({ permission: "notifications:manage-own", body: notificationSettingsSchema }, async ({ user, body }) => {
  await saveNotificationPreferences(user.id, body);
  return jsonResponse(notificationSettingsSchema, await notificationPreferencesFor(user.id));
});
