import { describe, expect, it } from "vitest";
import { retryDelayS } from "@/db/queries/mail-outbox";
import { LAB_ROLES, ROLE_MEANING, roleInWords } from "@/lib/contracts/roles";
import { invitationMail, quotedUserText } from "@/lib/mail/messages";

describe("user text in our mail", () => {
  const hostile = "Security team: your account expires today, confirm at http://evil.test/x";
  it("never reaches the Subject", () => {
    const mail = invitationMail({
      labName: `${hostile}'s lab`,
      inviterName: hostile,
      role: "viewer",
      link: "https://g.test/invite/a",
      days: 7,
    });
    expect(mail.subject).toBe("You are invited to a lab on Gyrolux");
    expect(mail.subject).not.toContain("Security");
  });
  it("is quoted, one line, short, and has nothing a mail program would turn into a link", () => {
    const quoted = quotedUserText(`${hostile}\r\nBcc: x@y.test`);
    expect(quoted.startsWith("“") && quoted.endsWith("”")).toBe(true);
    expect(quoted).not.toMatch(/[\r\n]/);
    expect(quoted).not.toMatch(/https?:\/\/|\w\.\w|@/);
    expect([...quoted].length).toBeLessThanOrEqual(82);
    expect(quotedUserText("Lindqvist Moor Faraday Laboratory")).toBe("“Lindqvist Moor Faraday Laboratory”");
  });
  it("keeps the only link in an invitation ours", () => {
    const mail = invitationMail({
      labName: "evil.test",
      inviterName: "www.evil.test",
      role: "editor",
      link: "https://g.test/invite/a",
      days: 7,
    });
    expect(mail.text.match(/https?:\/\/\S+/g)).toEqual(["https://g.test/invite/a"]);
    expect(mail.text).not.toContain("evil.test");
  });
});

describe("outbox retries", () => {
  it("double from 5 s and stop growing at 30 minutes", () => {
    expect([1, 2, 3, 4].map(retryDelayS)).toEqual([5, 10, 20, 40]);
    expect(retryDelayS(40)).toBe(1800);
  });
});

describe("the invitation mail", () => {
  it("words each role as the lab page does", () => {
    for (const role of LAB_ROLES) {
      const mail = invitationMail({ labName: "Lab", inviterName: "Ada", role, link: "https://x.test/invite/t", days: 7 });
      expect(mail.text).toContain(`as ${roleInWords(role)}.`);
      expect(mail.text).toContain(ROLE_MEANING[role]);
    }
    expect(roleInWords("viewer")).toBe("viewer (reads sets)");
  });
});
