import { describe, expect, it } from "vitest";
import { AUDIT_ACTIONS, AUDIT_KINDS, canReadAnyAudit } from "@/lib/contracts/audit";
import { AUDIT_KIND_LABEL, auditDetailText, describeAuditEntry } from "@/lib/text/audit";

const entry = (
  action: string,
  details: Record<string, unknown> = {},
  targetName: string | null = null,
  set: { id: string; name: string | null } | null = null,
) => ({
  action,
  details,
  targetName,
  set,
});

describe("audit entries in words", () => {
  it("has words for every action, never the stored key or a missing value", () => {
    for (const action of AUDIT_ACTIONS) {
      const text = describeAuditEntry(entry(action, { version: 3, role: "editor", from: "editor", to: "viewer" }, "Target"));
      expect(text, action).not.toContain(action);
      expect(text, action).not.toMatch(/undefined|null|\.\w+_/);
      expect(text.length, action).toBeGreaterThan(4);
    }
  });

  it("says whose role changed, and from what to what", () => {
    expect(describeAuditEntry(entry("member.role", { from: "editor", to: "viewer" }, "Dr. Tomasz Elbrecht"))).toBe(
      "changed the role of Dr. Tomasz Elbrecht from editor to viewer",
    );
    expect(describeAuditEntry(entry("member.remove", { from: "viewer", to: null }, "A. Student"))).toBe(
      "removed A. Student from the lab (was viewer)",
    );
  });

  it("names the set of a share link and of a plan", () => {
    expect(describeAuditEntry(entry("share_link.create", { linkId: "x" }, "TGG handbook"))).toBe("made a share link to “TGG handbook”");
    expect(describeAuditEntry(entry("plan.save", { setId: "s" }, "Cold run", { id: "s", name: "TGG handbook" }))).toBe(
      "saved the plan “Cold run” for “TGG handbook”",
    );
  });

  it("says which version a save, a fit and a restore made", () => {
    expect(describeAuditEntry(entry("parameter_set.update", { version: 4, changed: ["params"] }, "TGG"))).toBe("saved version 4 of “TGG”");
    expect(describeAuditEntry(entry("parameter_set.restore", { version: 5, restoredVersion: 2 }, "TGG"))).toBe(
      "restored version 2 of “TGG” as version 5",
    );
    expect(auditDetailText(entry("parameter_set.update", { changed: ["params", "description"] }))).toBe("changed params, description");
  });

  it("counts a run's cells with the right plural", () => {
    expect(describeAuditEntry(entry("run.submit", { kind: "map", cells: 1 }))).toBe("submitted a lab run (map, 1 cell)");
    expect(describeAuditEntry(entry("run.submit", { kind: "map", cells: 4096 }))).toBe("submitted a lab run (map, 4096 cells)");
  });

  it("falls back to the key for an action it does not know, and without a target to plain words", () => {
    expect(describeAuditEntry(entry("member.add"))).toBe("recorded “member.add”");
    expect(describeAuditEntry(entry("invitation.revoke"))).toBe("withdrew the invitation of someone");
  });

  it("names the personal lab someone created", () => {
    expect(describeAuditEntry(entry("lab.create", { name: "Ada's lab" }))).toBe("created the personal lab “Ada's lab”");
    expect(describeAuditEntry(entry("lab.create"))).toBe("created the personal lab");
  });

  it("labels every kind of the filter", () => {
    for (const kind of AUDIT_KINDS) expect(AUDIT_KIND_LABEL[kind]).toBeTruthy();
  });
});

describe("who can open the audit page", () => {
  it("owners of some lab only", () => {
    expect(canReadAnyAudit(["viewer", "owner"])).toBe(true);
    expect(canReadAnyAudit(["editor", "viewer"])).toBe(false);
    expect(canReadAnyAudit([])).toBe(false);
  });
});
