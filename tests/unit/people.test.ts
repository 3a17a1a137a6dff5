import { describe, expect, it } from "vitest";
import { personLabel, UNNAMED_CONTRIBUTOR } from "@/lib/people";

const named = { name: "Ines Okafor", email: "ines@example.test" };
const unnamed = { name: null, email: "ines@example.test" };

describe("personLabel", () => {
  it("uses the name whoever looks", () => {
    expect(personLabel(named, { mayShowEmail: false })).toBe("Ines Okafor");
    expect(personLabel(named, { mayShowEmail: true })).toBe("Ines Okafor");
  });

  it("shows the address in place of a missing name only to those who may see it", () => {
    expect(personLabel(unnamed, { mayShowEmail: true })).toBe("ines@example.test");
    expect(personLabel(unnamed, { mayShowEmail: false })).toBe(UNNAMED_CONTRIBUTOR);
  });

  it("treats a blank name as missing", () => {
    expect(personLabel({ name: "   ", email: "ines@example.test" }, { mayShowEmail: false })).toBe(
      UNNAMED_CONTRIBUTOR,
    );
    expect(personLabel({ name: "", email: "ines@example.test" }, { mayShowEmail: true })).toBe(
      "ines@example.test",
    );
  });

  it("does not let a name that is the address itself through to those who may not see it", () => {
    const self = { name: "Ines@Example.test", email: "ines@example.test" };
    expect(personLabel(self, { mayShowEmail: false })).toBe(UNNAMED_CONTRIBUTOR);
    expect(personLabel(self, { mayShowEmail: true })).toBe("Ines@Example.test");
  });

  it("falls back to the label the caller gives when there is neither name nor address", () => {
    expect(personLabel({ name: null, email: null }, { mayShowEmail: true })).toBe(
      UNNAMED_CONTRIBUTOR,
    );
    expect(
      personLabel(
        { name: null, email: "ed@example.test" },
        { mayShowEmail: false, unnamed: "Someone" },
      ),
    ).toBe("Someone");
  });
});
