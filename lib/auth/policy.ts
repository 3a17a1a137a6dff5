/**
 * Who may do what inside one anthology. The single table every route handler, server action
 * and page consults (through lib/auth/guard.ts); pure so it can be tested as a table.
 */
import type { Role } from "@/lib/domain";

export const ACTIONS = {
  "anthology:view": ["lead", "editor", "finisher", "contributor"],
  "anthology:edit-spec": ["lead", "editor"],
  "members:manage": ["lead"],
  "members:invite": ["lead", "editor"],
  "call:edit": ["lead", "editor"],
  "call:edit-terms": ["lead"],
  "stage:advance": ["lead", "editor"],
  "pieces:review": ["lead", "editor"],
  "pieces:submit": ["contributor"],
  "pieces:view-own": ["contributor"],
  "map:view": ["lead", "editor", "finisher"],
  "map:edit": ["lead", "editor"],
  "production:view": ["lead", "editor", "finisher"],
  "print:produce": ["lead", "editor"],
  "print:view": ["lead", "editor", "finisher"],
  "finishing:mark-done": ["lead", "editor", "finisher"],
  "run:view": ["lead", "editor"],
  "run:plan": ["lead", "editor"],
  "finishing:view": ["lead", "editor", "finisher"],
  "finishing:tick": ["lead", "editor", "finisher"],
  "stock:view": ["lead", "editor", "finisher"],
  "stock:move": ["lead", "editor", "finisher"],
  "contributors:private-data": ["lead", "editor"],
  /** The credits screen: credit lines, asking contributors to approve them, changing a line. */
  "credits:manage": ["lead", "editor"],
  /** Recording sales and seeing net sales and the contributors' pool. */
  "sales:record": ["lead", "editor"],
  /** The ledger of every contributor: closing periods, paying, statements, exports. */
  "payouts:manage": ["lead"],
  /** A contributor's own ledger lines, statements and payout account. */
  "payouts:view-own": ["contributor"],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof ACTIONS;

/** True when a member with `role` (null: not a member) may perform `action`. */
export function can(role: Role | null | undefined, action: Action): boolean {
  if (!role) return false;
  return (ACTIONS[action] as readonly Role[]).includes(role);
}

/** Which roles an inviter may hand out: leads invite anyone; editors invite all but leads. */
export function rolesInvitableBy(role: Role | null | undefined): Role[] {
  if (role === "lead") return ["lead", "editor", "finisher", "contributor"];
  if (role === "editor") return ["editor", "finisher", "contributor"];
  return [];
}

/**
 * Who may see one piece, its files and previews: the anthology's lead and editors, and the
 * contributor who sent it. Everyone else (finishers, other contributors) may not.
 */
export function maySeePiece(role: Role | null | undefined, isOwner: boolean): boolean {
  if (can(role, "pieces:review")) return true;
  return isOwner && can(role, "pieces:view-own");
}

/**
 * Whether a piece counts as public for other contributors' proofs: its contributor approved its
 * credit line, so they have agreed to how it appears in the book; until then others see only
 * its title on a shared spread, never its artwork.
 */
export function pieceIsPublic(piece: { creditApprovedAt: Date | null }): boolean {
  return piece.creditApprovedAt !== null;
}

/**
 * Who may see a neighbour's artwork thumbnail in the proof of their own piece: a member who may
 * see their own pieces (a contributor), whose own piece shares a reader spread with it, and only
 * when the neighbour is public. Editors use the ordinary preview (`maySeePiece`) instead.
 */
export function maySeeProofNeighbour(
  role: Role | null | undefined,
  facts: { sharesSpreadWithOwnPiece: boolean; neighbourIsPublic: boolean },
): boolean {
  return can(role, "pieces:view-own") && facts.sharesSpreadWithOwnPiece && facts.neighbourIsPublic;
}

/** Why a change to someone's role can be refused, in plain words. */
export const ROLE_CHANGE_REFUSALS = {
  "not-member": "That person is not a member of this anthology.",
  "last-lead":
    "An anthology needs a lead editor: make someone else lead before changing or removing this one.",
} as const;
export type RoleChangeRefusal = keyof typeof ROLE_CHANGE_REFUSALS;

/**
 * Why a change to someone's role (null: removing them) is refused, or null when it may go ahead.
 * An anthology always keeps at least one lead editor.
 */
export function roleChangeRefusal(
  members: readonly { userId: string; role: Role }[],
  userId: string,
  newRole: Role | null,
): RoleChangeRefusal | null {
  const member = members.find((m) => m.userId === userId);
  if (!member) return "not-member";
  if (member.role === "lead" && newRole !== "lead") {
    const leads = members.filter((m) => m.role === "lead").length;
    if (leads <= 1) return "last-lead";
  }
  return null;
}
