import { z } from "zod";

export const invitationSummarySchema = z.object({
  id: z.string(),
  email: z.string(),
  role: z.enum(["technician", "reviewer"]),
  state: z.enum(["pending", "accepted", "revoked", "expired"]),
  expiresAt: z.date(),
  sentCount: z.number(),
  createdAt: z.date(),
});
export type InvitationSummaryJson = Omit<z.infer<typeof invitationSummarySchema>, "expiresAt" | "createdAt"> & { expiresAt: string; createdAt: string };

export const invitationListSchema = z.object({ invitations: z.array(invitationSummarySchema) });
