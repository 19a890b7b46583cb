import { z } from "zod";

import { roles } from "@/db/schema";
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from "@/lib/server/auth/passwords";

// Shared form rules: one message per rule, worded for the person filling the form.
export const emailSchema = z
  .string({ error: "Enter an e-mail address." })
  .trim()
  .min(1, "Enter an e-mail address.")
  .max(320, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address, like name@example.com." }));

export const personNameSchema = z
  .string({ error: "Enter a name." })
  .trim()
  .min(1, "Enter a name.")
  .max(120, "Keep the name under 120 characters.")
  .refine((v) => !/[\u0000-\u001f\u007f]/.test(v), "The name contains control characters.");

export const newPasswordSchema = z
  .string({ error: "Enter a password." })
  .min(1, "Enter a password.")
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`)
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`);

export const roleSchema = z.enum(roles, { error: "Choose one of the roles." });

export const idSchema = (prefix: string) =>
  z
    .string({ error: "Missing id." })
    .max(64, "Unknown id.")
    .regex(new RegExp(`^${prefix}_[0-9a-z]+$`), "Unknown id.");

export const tokenSchema = z.string().min(20).max(200).regex(/^[A-Za-z0-9_-]+$/);
