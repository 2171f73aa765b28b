import { z } from "zod";
import { membershipRoles } from "@/lib/trials/vocabulary";
import { emailSchema, nameSchema, passwordSchema } from "./auth";
import { uuidSchema } from "./common";

export const createInvitationSchema = z
  .object({
    trialId: uuidSchema,
    email: emailSchema,
    role: z.enum(membershipRoles, "Choose technician or reviewer."),
  })
  .strict();
export type CreateInvitationInput = z.input<typeof createInvitationSchema>;

export const invitationListQuery = z.object({ trialId: uuidSchema }).strict();
export const invitationIdParams = z.object({ invitationId: uuidSchema }).strict();

export const linkTokenSchema = z.string().trim().min(20, "That link is incomplete.").max(200, "That link is not valid.");

/** Accepting: signed in as the invited address, or creating the account with name and password. */
export const acceptInvitationSchema = z
  .object({
    token: linkTokenSchema,
    name: nameSchema.optional(),
    password: passwordSchema.optional(),
    confirmPassword: z.string().optional(),
  })
  .strict()
  .refine((value) => value.password === undefined || value.password === value.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });
export type AcceptInvitationInput = z.input<typeof acceptInvitationSchema>;

/** The form shown to someone without an account. */
export const newAccountFromInvitationSchema = z
  .object({ name: nameSchema, password: passwordSchema, confirmPassword: z.string() })
  .refine((value) => value.password === value.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." });
