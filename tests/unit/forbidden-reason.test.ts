import { describe, expect, it } from "vitest";
import { anthologySlugOfPath, forbiddenReason } from "@/lib/auth/forbidden";

describe("anthologySlugOfPath", () => {
  it("reads the slug of an anthology's studio pages", () => {
    expect(anthologySlugOfPath("/studio/low-tide-almanac")).toBe("low-tide-almanac");
    expect(anthologySlugOfPath("/studio/low-tide-almanac/map")).toBe("low-tide-almanac");
  });
  it("is null for studio pages that belong to no anthology, and for no path", () => {
    expect(anthologySlugOfPath("/studio")).toBeNull();
    expect(anthologySlugOfPath("/studio/new")).toBeNull();
    expect(anthologySlugOfPath("/studio/account")).toBeNull();
    expect(anthologySlugOfPath(null)).toBeNull();
    expect(anthologySlugOfPath("/studio/%E0%A4%A")).toBeNull();
  });
});

describe("forbiddenReason", () => {
  const jam = { title: "Heron Street Comics Jam", slug: "heron-street-comics-jam" };
  it("a member is refused for their role", () => {
    expect(forbiddenReason(jam, true, true)).toEqual({ kind: "role" });
  });
  it("an outsider is told how to join, with the call only while it is open", () => {
    expect(forbiddenReason(jam, false, true)).toEqual({
      kind: "outsider",
      anthologyTitle: jam.title,
      openCallPath: "/calls/heron-street-comics-jam",
    });
    expect(forbiddenReason(jam, false, false)).toMatchObject({ openCallPath: null });
  });
  it("with no anthology known it falls back to the role wording", () => {
    expect(forbiddenReason(null, false, true)).toEqual({ kind: "role" });
  });
});
