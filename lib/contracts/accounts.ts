import { z } from "zod";
import { emailField, safeString } from "./validation";

/** Accounts: sign-in, sign-up and password inputs, shared by the server actions, the API and the forms. */

/** Password bounds, importable by client forms (no bcrypt here). bcrypt ignores bytes past 72. */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_BYTES = 72;
/** Kept for forms that show a character hint; the real limit is PASSWORD_MAX_BYTES. */
export const PASSWORD_MAX_LENGTH = PASSWORD_MAX_BYTES;

export function passwordBytes(password: string): number {
  return new TextEncoder().encode(password).byteLength;
}

const email = emailField("Enter your e-mail address.");

/** bcrypt reads only the first 72 bytes, so the limit is on UTF-8 bytes, not characters. */
function newPasswordSchema() {
  return safeString({ error: "Choose a password." })
    .min(PASSWORD_MIN_LENGTH, `At least ${PASSWORD_MIN_LENGTH} characters.`)
    .refine((value) => passwordBytes(value) <= PASSWORD_MAX_BYTES, {
      message: `At most ${PASSWORD_MAX_BYTES} bytes (${PASSWORD_MAX_BYTES} plain letters; accented letters and symbols count 2–4).`,
    });
}

export const signInSchema = z.object({
  email,
  password: safeString({ error: "Enter your password." }).min(1, "Enter your password.").max(1024, "That password is too long."),
});

export const signUpSchema = z.object({
  name: safeString({ error: "Enter your name." }).trim().min(1, "Enter your name.").max(120, "At most 120 characters."),
  email,
  password: newPasswordSchema(),
  /** The secret of an invitation link: the new account joins that lab instead of getting a personal lab. */
  invitationToken: safeString({ error: "The invitation link is incomplete." }).max(200, "The invitation link is not valid.").optional(),
});

export const emailOnlySchema = z.object({ email });

export const changePasswordSchema = z.object({
  currentPassword: safeString({ error: "Enter your current password." })
    .min(1, "Enter your current password.")
    .max(1024, "That password is too long."),
  newPassword: newPasswordSchema(),
});

export const resetPasswordSchema = z.object({
  token: safeString({ error: "The reset link is incomplete." })
    .min(10, "The reset link is incomplete.")
    .max(200, "The reset link is not valid."),
  newPassword: newPasswordSchema(),
});

export const confirmEmailSchema = z.object({
  token: safeString({ error: "The confirmation link is incomplete." })
    .min(10, "The confirmation link is incomplete.")
    .max(200, "The confirmation link is not valid."),
});

export type SignInInput = z.infer<typeof signInSchema>;
export type SignUpInput = z.infer<typeof signUpSchema>;
