import { type LabRole, roleInWords } from "@/lib/contracts/roles";

/* The texts of the e-mails Gyrolux sends; plain text, every link absolute and single-purpose. */

export function invitationMail(options: { labName: string; inviterName: string; role: LabRole; link: string; days: number }) {
  return {
    subject: `Invitation to ${options.labName} on Gyrolux`,
    text: [
      `${options.inviterName} invites you to join ${options.labName} on Gyrolux as ${roleInWords(options.role)}.`,
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
