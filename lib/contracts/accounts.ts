import { z } from "zod";
import { safeString } from "@/lib/api/text";
import { PASSWORD_MAX_BYTES, PASSWORD_MIN_LENGTH, passwordBytes } from "./password-rules";

/** Sign-in and sign-up inputs, shared by the server actions, the sign-up API and the forms (client-safe). */

const email = safeString({ error: "Enter your e-mail address." })
  .trim()
  .toLowerCase()
  .max(320, "That e-mail address is too long.")
  .pipe(z.email({ error: "Enter a valid e-mail address." }));

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

export type SignInInput = z.infer<typeof signInSchema>;
export type SignUpInput = z.infer<typeof signUpSchema>;
