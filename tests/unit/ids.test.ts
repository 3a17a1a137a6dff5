import { describe, expect, it } from "vitest";
import { parseId } from "@/lib/ids";

describe("parseId", () => {
  it("reads plain positive whole numbers", () => {
    expect(parseId("1")).toBe(1);
    expect(parseId("007")).toBe(7);
    expect(parseId("999999999999999")).toBe(999_999_999_999_999);
  });
  it("refuses everything else", () => {
    for (const bad of [
      "0",
      "-1",
      "+1",
      "1.0",
      "1e3",
      " 1",
      "1 ",
      "",
      "0x10",
      "1234567890123456",
      "١",
    ])
      expect(parseId(bad), JSON.stringify(bad)).toBeNull();
  });
});
