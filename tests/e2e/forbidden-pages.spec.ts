import { expect, test } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

// Demo data (db/seed/demo-press.ts): Tomasz is a contributor in Low Tide Almanac; Odile leads Low
// Tide Almanac and has no part in Heron Street Comics Jam (planning stage, no open call).

test("a contributor opening editor pages gets 403 and the page about roles", async ({ page }) => {
  const contributor = demoAccount("tomasz");
  await signInWithPassword(page, contributor.email, contributor.password);
  for (const path of ["/studio/low-tide-almanac/map", "/studio/low-tide-almanac/submissions"]) {
    const response = await page.goto(path);
    expect(response?.status(), path).toBe(403);
    await expect(page.getByTestId("forbidden")).toContainText("your role in this anthology");
    await expect(page.getByTestId("forbidden-outsider")).toHaveCount(0);
  }
});

test("a lead opening a contributor's page gets 403 about roles", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  const response = await page.goto("/studio/low-tide-almanac/my-pieces");
  expect(response?.status()).toBe(403);
  await expect(page.getByTestId("forbidden")).toContainText("your role in this anthology");
});

test("someone outside an anthology gets 403 saying they are not a member and how to join", async ({
  page,
}) => {
  const outsider = demoAccount("odile");
  await signInWithPassword(page, outsider.email, outsider.password);
  for (const path of [
    "/studio/heron-street-comics-jam",
    "/studio/heron-street-comics-jam/my-pieces",
    "/studio/heron-street-comics-jam/map",
  ]) {
    const response = await page.goto(path);
    expect(response?.status(), path).toBe(403);
    const notice = page.getByTestId("forbidden");
    await expect(notice).toContainText("You are not a member of this anthology");
    await expect(notice).toContainText("ask one of its editors for an invitation");
    await expect(notice).not.toContainText("your role");
  }
});
