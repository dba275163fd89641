/** Password bounds, importable by client forms (no bcrypt here). bcrypt ignores bytes past 72. */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_BYTES = 72;
/** Kept for forms that show a character hint; the real limit is PASSWORD_MAX_BYTES. */
export const PASSWORD_MAX_LENGTH = PASSWORD_MAX_BYTES;

export function passwordBytes(password: string): number {
  return new TextEncoder().encode(password).byteLength;
}
