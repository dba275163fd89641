import { simpleParser } from "mailparser";

/*
 * Reads a caught message with mailparser (the nodemailer maintainers' parser): transfer encodings,
 * charsets, multipart bodies and RFC 2047 encoded words, where adjacent encoded words join
 * without the space between them (RFC 2047 §6.2). Used by the local SMTP stand-in.
 */

export interface ParsedMessage {
  subject: string;
  text: string;
}

export async function parseMessage(raw: Buffer | string): Promise<ParsedMessage> {
  const parsed = await simpleParser(raw, { skipHtmlToText: true, skipImageLinks: true, skipTextToHtml: true, skipTextLinks: true });
  return { subject: parsed.subject ?? "", text: (parsed.text ?? "").replace(/\r\n/g, "\n") };
}
