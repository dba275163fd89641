import { describe, expect, it } from "vitest";
import { LAB_ROLES, ROLE_MEANING, roleInWords } from "@/lib/contracts/roles";
import { invitationMail } from "@/lib/mail/messages";

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
