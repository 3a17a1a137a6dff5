import { expect, test } from "@playwright/test";
import { demoAccount, uniqueEmail } from "../helpers/demo";
import { extractLinks, waitForMessage } from "../helpers/outbox";
import { signInWithPassword } from "./helpers";

test("sign up, sign out, sign in again with the password", async ({ page }) => {
  const email = uniqueEmail("wren");
  await page.goto("/sign-up");
  await page.locator("#name").fill("Wren Aldous");
  await page.locator("#email").fill(email);
  await page.locator("#password").fill("fennel-cabin-42");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page).toHaveURL(/\/studio$/);
  await expect(page.getByTestId("empty-studio")).toBeVisible();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByRole("navigation").getByRole("link", { name: "Sign in" })).toBeVisible();
  await expect(page.getByTestId("signed-in-as")).toHaveCount(0);
  await signInWithPassword(page, email, "fennel-cabin-42");
  await expect(page).toHaveURL(/\/studio$/);
});

test("sign-up shows field errors and refuses an e-mail already registered", async ({ page }) => {
  await page.goto("/sign-up");
  await page.locator("#name").fill("Someone");
  await page.locator("#email").fill("not-an-address");
  await page.locator("#password").fill("short");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByTestId("error-email")).toContainText("e-mail address");
  await expect(page.getByTestId("error-password")).toContainText("at least 10 characters");

  await page.locator("#email").fill(demoAccount("odile").email);
  await page.locator("#password").fill("perfectly-fine-99");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByTestId("error-email")).toContainText("already exists");
  await expect(page).toHaveURL(/\/sign-up/);
});

test("a wrong password says so without signing in", async ({ page }) => {
  await page.goto("/sign-in");
  await page.locator("#pw-email").fill(demoAccount("odile").email);
  await page.locator("#pw-password").fill("not-her-password-1");
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByTestId("sign-in-error")).toContainText("do not match");
});

test("sign in by an e-mail link read from the mail sink; the link works once", async ({
  page,
  browser,
}) => {
  const email = uniqueEmail("linnea");
  await page.goto("/sign-in");
  await page.locator("#link-email").fill(email);
  await page.getByRole("button", { name: "Send me a sign-in link" }).click();
  await expect(page.getByTestId("check-email")).toContainText(email);

  const message = await waitForMessage({ to: email, subject: /sign-in link/ });
  const link = extractLinks(message.text).find((l) => l.includes("/api/auth/callback/nodemailer"));
  expect(link, "the mail carries the callback link").toBeTruthy();
  await page.goto(link!);
  await expect(page.getByTestId("signed-in-as")).toHaveText(email);

  const other = await browser.newContext();
  const second = await other.newPage();
  await second.goto(link!);
  await expect(second.getByTestId("sign-in-problem")).toContainText("no longer works");
  await other.close();
});

test("create an anthology with a custom trim", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.getByRole("link", { name: "New anthology" }).click();
  const title = `Mudflat Postcards ${Date.now().toString(36)}`;
  await page.locator("#title").fill(title);
  await page.locator("#trimChoice").selectOption("custom");
  await page.locator("#customWidth").fill("4");
  await page.locator("#customHeight").fill("6");
  await page.locator("#pageCountTarget").fill("18");
  await page.getByRole("button", { name: "Create anthology" }).click();
  await expect(page.getByTestId("error-pageCountTarget")).toContainText("try 16 or 20");
  await page.locator("#pageCountTarget").fill("16");
  await page.getByRole("button", { name: "Create anthology" }).click();
  await expect(page.getByTestId("anthology-title")).toHaveText(title);
  // 4 x 6 in = 101.6 x 152.4 mm (1 in = 25.4 mm exactly, NBS Circular 572)
  await expect(page.getByTestId("spec-summary")).toContainText("101.6 x 152.4 mm");
  await page.goto("/studio");
  await expect(page.getByTestId("role-group-lead")).toContainText(title);
});

test("a contributor opening an editor page gets the 403 page", async ({ page }) => {
  const contributor = demoAccount("tomasz");
  await signInWithPassword(page, contributor.email, contributor.password);
  const response = await page.goto("/studio/low-tide-almanac/members");
  expect(response?.status()).toBe(403);
  await expect(page.getByTestId("forbidden")).toBeVisible();
});

test("signed-out visitors of studio pages are sent to sign-in and come back", async ({ page }) => {
  await page.goto("/studio/low-tide-almanac");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fstudio%2Flow-tide-almanac/);
  const lead = demoAccount("odile");
  await page.locator("#pw-email").fill(lead.email);
  await page.locator("#pw-password").fill(lead.password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByTestId("anthology-title")).toHaveText("Low Tide Almanac");
});

test("an unknown anthology is a 404 page", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  const response = await page.goto("/studio/no-such-anthology");
  expect(response?.status()).toBe(404);
  await expect(page.getByTestId("not-found")).toBeVisible();
});

test("API: 401 without a session, 400 for bad JSON and schema failures, 404 for unknown anthologies", async ({
  request,
  page,
}) => {
  const anonymous = await request.get("/api/anthologies");
  expect(anonymous.status()).toBe(401);
  expect(await anonymous.json()).toEqual({ error: "Sign in first." });

  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  const api = page.request;
  const notJson = await api.post("/api/anthologies", {
    data: Buffer.from("{not json"),
    headers: { "content-type": "application/json" },
  });
  expect(notJson.status()).toBe(400);
  expect((await notJson.json()).error).toContain("not valid JSON");

  const bad = await api.post("/api/anthologies", { data: { title: "", trimChoice: "b99" } });
  expect(bad.status()).toBe(400);
  const body = await bad.json();
  expect(Object.keys(body.fields)).toEqual(expect.arrayContaining(["title", "trimChoice"]));

  expect((await api.get("/api/anthologies/no-such-anthology")).status()).toBe(404);
});

test("an editor invites a person by e-mail; they join with that role", async ({
  page,
  browser,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto("/studio/heron-street-comics-jam/members");
  expect(await page.getByTestId("forbidden").count()).toBe(1);

  await page.goto("/studio/low-tide-almanac/members");
  const email = uniqueEmail("juniper");
  await page.locator("#invite-email").fill(email);
  await page.locator("#invite-role").selectOption("editor");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByTestId("invite-result")).toContainText(`Invitation sent to ${email}`);

  const message = await waitForMessage({ to: email, subject: /invited to Low Tide Almanac/ });
  const link = extractLinks(message.text).find((l) => l.includes("/invite/"));
  const guest = await (await browser.newContext()).newPage();
  await guest.goto("/sign-up");
  await guest.locator("#name").fill("Juniper Ashe");
  await guest.locator("#email").fill(email);
  await guest.locator("#password").fill("marsh-lantern-31");
  await guest.getByRole("button", { name: "Create account" }).click();
  await expect(guest).toHaveURL(/\/studio$/);
  await guest.goto(link!);
  // A password account has only typed the address in: a sign-in link sent to it confirms it.
  await expect(guest.getByRole("button", { name: "Accept the invitation" })).toHaveCount(0);
  await guest.getByRole("button", { name: /E-mail a sign-in link/ }).click();
  await expect(guest.getByTestId("check-email")).toBeVisible();
  const confirm = await waitForMessage({ to: email, subject: /sign-in link/ });
  await guest.goto(extractLinks(confirm.text).find((l) => l.includes("/callback/nodemailer"))!);
  await expect(guest).toHaveURL(/\/invite\//);
  await guest.getByRole("button", { name: "Accept the invitation" }).click();
  await expect(guest.getByTestId("role-group-editor")).toContainText("Low Tide Almanac");
  await guest.goto(link!);
  await expect(guest.getByTestId("invitation-problem")).toContainText("already been accepted");
});
