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

// Any origin will do: only whether the path stays on it matters.
const PROBE_ORIGIN = "http://return-path.invalid";

/**
 * Where to go after signing in: a path on this site, or "/". Browsers read "/\host" and
 * "//host" as other sites, so the path is resolved the way a browser would and kept only if
 * it stays on the same origin.
 */
export const returnPathSchema = z
  .string()
  .max(2000)
  .transform((value) => {
    if (!value.startsWith("/") || /[\u0000-\u001f\\]/.test(value)) return "/";
    const resolved = new URL(value, PROBE_ORIGIN);
    return resolved.origin === PROBE_ORIGIN ? `${resolved.pathname}${resolved.search}${resolved.hash}` : "/";
  })
  .catch("/");
