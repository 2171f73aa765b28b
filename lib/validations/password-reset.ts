import { z } from "zod";
import { emailSchema, passwordSchema } from "./auth";
import { linkTokenSchema } from "./invitations";

export const requestPasswordResetSchema = z.object({ email: emailSchema }).strict();
export type RequestPasswordResetInput = z.input<typeof requestPasswordResetSchema>;

export const newPasswordSchema = z
  .object({ password: passwordSchema, confirmPassword: z.string() })
  .refine((value) => value.password === value.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." });

export const confirmPasswordResetSchema = z
  .object({ token: linkTokenSchema, password: passwordSchema, confirmPassword: z.string() })
  .strict()
  .refine((value) => value.password === value.confirmPassword, { path: ["confirmPassword"], message: "The two passwords differ." });
export type ConfirmPasswordResetInput = z.input<typeof confirmPasswordResetSchema>;
