import { z } from "zod";
import { roles } from "@/lib/auth/roles";

export const emailSchema = z
  .string()
  .trim()
  .max(254, "That e-mail address is too long.")
  .pipe(z.email("Enter a valid e-mail address."))
  .transform((email) => email.toLowerCase());

export const passwordSchema = z
  .string()
  .min(10, "Use at least 10 characters.")
  .max(200, "Use at most 200 characters.");

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, "Enter your password.").max(200),
});

export const nameSchema = z.string().trim().min(2, "Enter your name.").max(120, "Use at most 120 characters.");

export const registerSchema = z
  .object({
    name: nameSchema,
    email: emailSchema,
    password: passwordSchema,
    confirmPassword: z.string(),
  })
  .strict()
  .refine((value) => value.password === value.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });

export const createUserSchema = z
  .object({
    name: nameSchema,
    email: emailSchema,
    role: z.enum(roles, "Choose a role."),
    password: passwordSchema,
  })
  .strict();

export type RegisterInput = z.input<typeof registerSchema>;
export type CreateUserInput = z.input<typeof createUserSchema>;
