import { describe, expect, it } from "vitest";
import {
  ACTIONS,
  can,
  maySeePiece,
  maySeeProofNeighbour,
  pieceIsPublic,
  roleChangeRefusal,
  rolesInvitableBy,
  type Action,
} from "@/lib/auth/policy";
import { ROLES, type Role } from "@/lib/domain";

// The product's role table: L = lead editor, E = editor, F = finisher, C = contributor.
const TABLE: Record<Action, string> = {
  "anthology:view": "LEFC",
  "anthology:edit-spec": "LE",
  "members:manage": "L",
  "members:invite": "LE",
  "call:edit": "LE",
  "call:edit-terms": "L",
  "stage:advance": "LE",
  "pieces:review": "LE",
  "pieces:submit": "C",
  "pieces:view-own": "C",
  "map:view": "LEF",
  "map:edit": "LE",
  "production:view": "LEF",
  "print:produce": "LE",
  "print:view": "LEF",
  "finishing:mark-done": "LEF",
  "run:view": "LE",
  "run:plan": "LE",
  "finishing:view": "LEF",
  "finishing:tick": "LEF",
  "stock:view": "LEF",
  "stock:move": "LEF",
  "contributors:private-data": "LE",
  "credits:manage": "LE",
  "sales:record": "LE",
  "payouts:manage": "L",
  "payouts:view-own": "C",
};
const LETTER: Record<Role, string> = { lead: "L", editor: "E", finisher: "F", contributor: "C" };

describe("role rules", () => {
  it("covers every action in the table", () => {
    expect(Object.keys(ACTIONS).sort()).toEqual(Object.keys(TABLE).sort());
  });

  for (const [action, letters] of Object.entries(TABLE) as [Action, string][]) {
    for (const role of ROLES) {
      const allowed = letters.includes(LETTER[role]);
      it(`${role} ${allowed ? "may" : "may not"} ${action}`, () => {
        expect(can(role, action)).toBe(allowed);
      });
    }
  }

  it("refuses everything to non-members", () => {
    for (const action of Object.keys(TABLE) as Action[]) {
      expect(can(null, action)).toBe(false);
      expect(can(undefined, action)).toBe(false);
    }
  });

  it("keeps finishers away from contributors' private data and money", () => {
    expect(can("finisher", "contributors:private-data")).toBe(false);
    expect(can("finisher", "payouts:manage")).toBe(false);
    expect(can("finisher", "sales:record")).toBe(false);
    expect(can("finisher", "payouts:view-own")).toBe(false);
  });

  it("lets only leads invite leads", () => {
    expect(rolesInvitableBy("lead")).toContain("lead");
    expect(rolesInvitableBy("editor")).toEqual(["editor", "finisher", "contributor"]);
    expect(rolesInvitableBy("finisher")).toEqual([]);
    expect(rolesInvitableBy("contributor")).toEqual([]);
  });
});

describe("who may see a piece", () => {
  it("is the anthology's lead and editors, and the piece's own contributor", () => {
    expect(maySeePiece("lead", false)).toBe(true);
    expect(maySeePiece("editor", false)).toBe(true);
    expect(maySeePiece("contributor", true)).toBe(true);
  });
  it("is never another contributor, the finisher or an outsider", () => {
    expect(maySeePiece("contributor", false)).toBe(false);
    expect(maySeePiece("finisher", false)).toBe(false);
    expect(maySeePiece(null, true)).toBe(false);
  });
});

describe("changing roles", () => {
  const members = [
    { userId: "wren", role: "lead" as const },
    { userId: "piet", role: "editor" as const },
    { userId: "ada", role: "contributor" as const },
  ];
  it("keeps the last lead: no demotion, no removal", () => {
    expect(roleChangeRefusal(members, "wren", "editor")).toBe("last-lead");
    expect(roleChangeRefusal(members, "wren", null)).toBe("last-lead");
    expect(roleChangeRefusal(members, "wren", "lead")).toBeNull();
  });
  it("lets a lead step down once there is another lead", () => {
    const twoLeads = [...members, { userId: "odo", role: "lead" as const }];
    expect(roleChangeRefusal(twoLeads, "wren", null)).toBeNull();
  });
  it("changes and removes other members, and refuses people who are not members", () => {
    expect(roleChangeRefusal(members, "piet", "finisher")).toBeNull();
    expect(roleChangeRefusal(members, "ada", null)).toBeNull();
    expect(roleChangeRefusal(members, "nobody", "editor")).toBe("not-member");
  });
});

describe("proof neighbours", () => {
  it("counts a piece public once its credit line is approved", () => {
    expect(pieceIsPublic({ creditApprovedAt: null })).toBe(false);
    expect(pieceIsPublic({ creditApprovedAt: new Date("2026-11-30T09:00:00Z") })).toBe(true);
  });

  it("shows a neighbour's artwork only to a contributor sharing the spread, and only when public", () => {
    const both = { sharesSpreadWithOwnPiece: true, neighbourIsPublic: true };
    expect(maySeeProofNeighbour("contributor", both)).toBe(true);
    expect(maySeeProofNeighbour("contributor", { ...both, neighbourIsPublic: false })).toBe(false);
    expect(maySeeProofNeighbour("contributor", { ...both, sharesSpreadWithOwnPiece: false })).toBe(
      false,
    );
    expect(maySeeProofNeighbour("finisher", both)).toBe(false);
    expect(maySeeProofNeighbour(null, both)).toBe(false);
  });
});
