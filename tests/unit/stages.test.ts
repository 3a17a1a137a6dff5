import { describe, expect, it } from "vitest";
import { ANTHOLOGY_STAGES, type AnthologyStage } from "@/lib/domain";
import {
  callPhase,
  isCallOpen,
  kindsText,
  nextStage,
  reviewStageMove,
  type CallDraft,
  type StageFacts,
} from "@/lib/stages";

const opensAt = new Date("2025-06-01T08:00:00Z");
const closesAt = new Date("2025-06-30T22:59:00Z");
const during = new Date("2025-06-15T12:00:00Z");

const call: CallDraft = {
  opensAt,
  closesAt,
  theme: "What the tide leaves",
  brief: "Drawings of what the water leaves behind on the mudflats.",
  allowedKinds: ["single", "spread"],
  allowedInks: ["black", "teal"],
  rightsAsked: "First printing rights for this edition.",
};

// The demo almanac's spec: half letter (5.5 x 8.5 in = 139.7 x 215.9 mm), 0.125 in bleed, duplicator in black and teal.
const facts = (over: Partial<StageFacts> = {}): StageFacts => ({
  stage: "planning",
  anthology: {
    trimWidthMm: 139.7,
    trimHeightMm: 215.9,
    bleedMm: 3.175,
    safeMarginMm: 6.35,
    minPpi: 300,
    printMethod: "duplicator",
    inks: ["black", "teal"],
  },
  call,
  pieces: { accepted: 0, awaitingReview: 0 },
  now: new Date("2025-05-20T12:00:00Z"),
  ...over,
});

describe("isCallOpen", () => {
  it("takes work from the opening moment up to, not including, the closing moment", () => {
    expect(isCallOpen(call, "call-open", new Date(opensAt.getTime() - 1))).toBe(false);
    expect(isCallOpen(call, "call-open", opensAt)).toBe(true);
    expect(isCallOpen(call, "call-open", during)).toBe(true);
    expect(isCallOpen(call, "call-open", new Date(closesAt.getTime() - 1))).toBe(true);
    expect(isCallOpen(call, "call-open", closesAt)).toBe(false);
  });

  it("is shut at every other stage, even between the dates", () => {
    for (const stage of ANTHOLOGY_STAGES.filter((s) => s !== "call-open"))
      expect(isCallOpen(call, stage, during)).toBe(false);
    expect(isCallOpen(null, "call-open", during)).toBe(false);
  });
});

describe("callPhase", () => {
  it.each<[AnthologyStage, Date, string]>([
    ["planning", during, "unpublished"],
    ["call-open", new Date("2025-05-01T00:00:00Z"), "upcoming"],
    ["call-open", during, "open"],
    ["call-open", new Date("2025-07-01T00:00:00Z"), "closed"],
    ["call-closed", during, "closed"],
    ["wrapped-up", during, "closed"],
  ])("at %s on %s the public page shows %s", (stage, now, phase) => {
    expect(callPhase(call, stage, now)).toBe(phase);
  });

  it("is unpublished without a call", () => {
    expect(callPhase(undefined, "call-open", during)).toBe("unpublished");
  });
});

describe("stage moves", () => {
  it("go one step forward at a time, in the order of ANTHOLOGY_STAGES", () => {
    expect(nextStage("planning")).toBe("call-open");
    expect(nextStage("printing")).toBe("wrapped-up");
    expect(nextStage("wrapped-up")).toBeNull();
    expect(reviewStageMove(facts(), "call-closed").problems).toEqual([
      `Stages move one step forward: after "Planning" comes "Call open".`,
    ]);
    expect(reviewStageMove(facts({ stage: "call-closed" }), "call-open").problems[0]).toMatch(
      /after "Call closed" comes "Laying out"/,
    );
    expect(reviewStageMove(facts({ stage: "call-open" }), "call-open").problems[0]).toMatch(
      /already/,
    );
    expect(reviewStageMove(facts({ stage: "wrapped-up" }), "printing").problems[0]).toMatch(
      /last stage/,
    );
  });

  it("open a complete call, with a caution when it opens later", () => {
    const review = reviewStageMove(facts(), "call-open");
    expect(review.problems).toEqual([]);
    expect(review.cautions[0]).toMatch(/takes work from 2025-06-01T08:00:00.000Z/);
    expect(reviewStageMove(facts({ now: during }), "call-open").cautions).toEqual([]);
  });

  it("refuse to open a call that is missing, unwritten, back to front or already over", () => {
    expect(reviewStageMove(facts({ call: null }), "call-open").problems).toEqual([
      "Write and save the open call first.",
    ]);
    expect(
      reviewStageMove(facts({ call: { ...call, brief: "  " } }), "call-open").problems,
    ).toEqual(["The call needs a brief."]);
    expect(
      reviewStageMove(facts({ call: { ...call, closesAt: opensAt } }), "call-open").problems,
    ).toEqual(["The call must close after it opens."]);
    expect(
      reviewStageMove(facts({ now: new Date("2025-07-02T00:00:00Z") }), "call-open").problems[0],
    ).toMatch(/has passed/);
  });

  it("refuse inks the anthology does not print with, and an unusable spec", () => {
    const pink = reviewStageMove(
      facts({ call: { ...call, allowedInks: ["black", "pink"] } }),
      "call-open",
    );
    expect(pink.problems).toEqual([
      "The call allows pink, which the anthology does not print with (black, teal).",
    ]);
    const cramped = reviewStageMove(
      facts({ anthology: { ...facts().anthology, safeMarginMm: 80 } }),
      "call-open",
    );
    expect(cramped.problems).toEqual([
      "Print spec: Safe margins of 80 mm on each side leave no room on the page, whose short side is 139.7 mm.",
    ]);
  });

  it("warn when a call closes early", () => {
    expect(
      reviewStageMove(facts({ stage: "call-open", now: during }), "call-closed").cautions[0],
    ).toMatch(/stops submissions early/);
    expect(
      reviewStageMove(
        facts({ stage: "call-open", now: new Date("2025-07-02T00:00:00Z") }),
        "call-closed",
      ).cautions,
    ).toEqual([]);
  });

  it("need an accepted piece before laying out", () => {
    expect(reviewStageMove(facts({ stage: "call-closed" }), "laying-out").problems).toEqual([
      "Accept at least one piece before laying out the pages.",
    ]);
    const ready = reviewStageMove(
      facts({ stage: "call-closed", pieces: { accepted: 3, awaitingReview: 2 } }),
      "laying-out",
    );
    expect(ready.problems).toEqual([]);
    expect(ready.cautions).toEqual(["2 pieces still wait for a read."]);
  });
});

describe("kindsText", () => {
  it("lists what a piece may be in plain words", () => {
    expect(kindsText(["single", "spread", "run"], 4)).toBe(
      "One page, two-page spread or run of up to 4 pages",
    );
    expect(kindsText(["spread"], 4)).toBe("Two-page spread");
    expect(kindsText(["single", "run"], 6)).toBe("One page or run of up to 6 pages");
  });
});
