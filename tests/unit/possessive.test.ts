import { describe, expect, it } from "vitest";
import { possessive } from "@/lib/possessive";

// Associated Press Stylebook, "possessives": proper names ending in s take only an apostrophe
// ("Achilles' heel", "Agnes' book"); others take 's. From memory.
describe("possessive", () => {
  it("gives a name ending in s only an apostrophe", () => {
    expect(possessive("Salt Lines")).toBe("Salt Lines’");
    expect(possessive("Agnes")).toBe("Agnes’");
    expect(possessive("THE MARSH NOTES")).toBe("THE MARSH NOTES’");
  });

  it("gives any other name ’s", () => {
    expect(possessive("Low Tide Almanac")).toBe("Low Tide Almanac’s");
    expect(possessive("Odile")).toBe("Odile’s");
    expect(possessive("Felix")).toBe("Felix’s");
  });

  it("ignores trailing spaces and never writes ’s after nothing", () => {
    expect(possessive("Salt Lines ")).toBe("Salt Lines’");
    expect(possessive("")).toBe("");
  });
});
