import { type LabRole, roleInWords } from "@/lib/contracts/roles";

/*
 * The texts of the e-mails Gyrolux sends; plain text, every link absolute and single-purpose.
 * Subjects are ours alone: a person's name or a lab's name is text anyone can choose ("Security
 * team: your account expires, confirm at http://…"), so it never goes into a Subject, and in a
 * body it appears only quoted and defanged, so no mail program turns it into a link.
 */

const USER_TEXT_MAX = 80;

/**
 * Text a user chose, as it may appear in our mail: one line, at most 80 characters, in quotes,
 * with the dots, colons, slashes and at-signs that make links and addresses replaced by look-alike
 * characters that no mail program links (U+2024 one dot leader, U+2236 ratio, U+2215 division
 * slash, U+FF20 fullwidth commercial at).
 */
export function quotedUserText(value: string): string {
  // biome-ignore lint/suspicious/noControlCharactersInRegex: removing control characters is the point
  const oneLine = value.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g, " ").trim();
  const short = oneLine.length > USER_TEXT_MAX ? `${oneLine.slice(0, USER_TEXT_MAX - 1)}…` : oneLine;
  const defanged = short.replace(/\./g, "\u2024").replace(/:/g, "\u2236").replace(/\//g, "\u2215").replace(/@/g, "\uff20");
  return `“${defanged}”`;
}

export function invitationMail(options: { labName: string; inviterName: string; role: LabRole; link: string; days: number }) {
  return {
    subject: "You are invited to a lab on Gyrolux",
    text: [
      `A Gyrolux user who calls themself ${quotedUserText(options.inviterName)} invites you to join the lab ` +
        `${quotedUserText(options.labName)} as ${roleInWords(options.role)}.`,
      "Names in quotes were typed by that user; Gyrolux has not checked them.",
      "",
      "Open this link to sign in or create an account, then accept:",
      options.link,
      "",
      `The link works once and expires in ${options.days} days. You join only if you accept.`,
      "If you did not expect this, ignore this e-mail.",
    ].join("\n"),
  };
}

export function passwordResetMail(options: { link: string; minutes: number }) {
  return {
    subject: "Reset your Gyrolux password",
    text: [
      "Someone (hopefully you) asked to reset the password of the Gyrolux account with this address.",
      "",
      "Choose a new password here:",
      options.link,
      "",
      `The link works once and expires in ${options.minutes} minutes. Setting a new password signs you out everywhere.`,
      "If you did not ask for this, ignore this e-mail; your password stays as it is.",
    ].join("\n"),
  };
}

export function signUpExistingMail(options: { signInLink: string; resetLink: string }) {
  return {
    subject: "Someone tried to create a Gyrolux account with your address",
    text: [
      "A Gyrolux account already uses this address, so no new account was made.",
      "",
      `If this was you, sign in: ${options.signInLink}`,
      `Forgot the password? Reset it: ${options.resetLink}`,
      "",
      "If it was not you, nothing changed and you can ignore this e-mail.",
    ].join("\n"),
  };
}

export function verifyEmailMail(options: { link: string; days: number }) {
  return {
    subject: "Confirm your e-mail address for Gyrolux",
    text: [
      "A Gyrolux account was created with this address. Confirm that it is yours:",
      options.link,
      "",
      `The link works once and expires in ${options.days} days. Until then the account can use its own lab but not invite anyone.`,
      "If you did not sign up, ignore this e-mail; nobody can invite people from an unconfirmed account.",
    ].join("\n"),
  };
}
