/*
 * Just enough MIME to read the single-part text messages Gyrolux sends (RFC 2045 §6.7
 * quoted-printable, §6.8 base64; RFC 2047 encoded-words in the subject). Used by the local SMTP
 * stand-in; not a general mail parser.
 */

export function decodeQuotedPrintable(body: string): Buffer {
  const joined = body.replace(/=\r?\n/g, "");
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const c = joined[i]!;
    const hex = joined.slice(i + 1, i + 3);
    if (c === "=" && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(c, "utf8"));
    }
  }
  return Buffer.from(bytes);
}

function decodeEncodedWords(value: string): string {
  return value.replace(/=\?([^?]+)\?([BbQq])\?([^?]*)\?=/g, (_all, _charset: string, kind: string, text: string) =>
    kind.toUpperCase() === "B"
      ? Buffer.from(text, "base64").toString("utf8")
      : decodeQuotedPrintable(text.replace(/_/g, " ")).toString("utf8"),
  );
}

export interface ParsedMessage {
  headers: Map<string, string>;
  subject: string;
  text: string;
}

export function parseMessage(raw: string): ParsedMessage {
  const split = raw.search(/\r?\n\r?\n/);
  const head = split < 0 ? raw : raw.slice(0, split);
  const body = split < 0 ? "" : raw.slice(split).replace(/^\r?\n\r?\n/, "");
  const headers = new Map<string, string>();
  // Folded header lines continue with whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\r?\n[ \t]+/g, " ").split(/\r?\n/)) {
    const colon = line.indexOf(":");
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  const encoding = (headers.get("content-transfer-encoding") ?? "7bit").toLowerCase();
  const text =
    encoding === "quoted-printable"
      ? decodeQuotedPrintable(body).toString("utf8")
      : encoding === "base64"
        ? Buffer.from(body.replace(/\s+/g, ""), "base64").toString("utf8")
        : body;
  return { headers, subject: decodeEncodedWords(headers.get("subject") ?? ""), text: text.replace(/\r\n/g, "\n") };
}
