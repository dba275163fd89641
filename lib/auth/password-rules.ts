/** Password bounds, importable by client forms (no bcrypt here). bcrypt ignores bytes past 72. */
export const PASSWORD_MIN_LENGTH = 8;
export const PASSWORD_MAX_LENGTH = 72;
