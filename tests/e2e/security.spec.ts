// Security defects that let a visitor become someone else: the local outbox, sessions that outlive
// sign-out, invitations opened by the wrong account, and cross-site writes with a valid cookie.
import { expect, test, type Browser, type Page } from "@playwright/test";
import { demoAccount, uniqueEmail } from "../helpers/demo";
import { extractLinks, waitForMessage } from "../helpers/outbox";
import { signInWithPassword } from "./helpers";

async function askForLink(browser: Browser, email: string) {
  const page = await (await browser.newContext()).newPage();
  await page.goto("/sign-in");
  await page.locator("#link-email").fill(email);
  await page.getByRole("button", { name: "Send me a sign-in link" }).click();
  await expect(page.getByTestId("check-email")).toBeVisible();
  await page.context().close();
}

test("the outbox is for signed-in people, and shows only their own mail", async ({
  page,
  browser,
}) => {
  await page.goto("/dev/outbox");
  await expect(page).toHaveURL(/\/sign-in\?callbackUrl=%2Fdev%2Foutbox/);
  await expect(page.getByTestId("outbox-message")).toHaveCount(0);

  const lead = demoAccount("odile");
  const bea = demoAccount("bea");
  // Anyone can ask for a sign-in link to the lead's address...
  await askForLink(browser, lead.email);
  await waitForMessage({ to: lead.email, subject: /sign-in link/ });
  await askForLink(browser, bea.email);
  await waitForMessage({ to: bea.email, subject: /sign-in link/ });

  // ...but only the lead could read it; a contributor's outbox shows her own mail alone.
  await signInWithPassword(page, bea.email, bea.password);
  await page.goto("/dev/outbox");
  const messages = page.getByTestId("outbox-message");
  await expect(messages.first()).toBeVisible();
  for (const text of await messages.allTextContents()) {
    expect(text).toContain(bea.email);
    expect(text).not.toContain(lead.email);
  }
});

async function signUp(page: Page, name: string, email: string, password: string) {
  await page.goto("/sign-up");
  await page.locator("#name").fill(name);
  await page.locator("#email").fill(email);
  await page.locator("#password").fill(password);
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page).toHaveURL(/\/studio$/);
}

test("a session token stops working at sign-out", async ({ page, browser }) => {
  // A fresh account: signing out ends every session of the person, and other tests use the demo ones.
  await signUp(page, "Orrin Sedge", uniqueEmail("orrin"), "pebble-gorse-64");
  const cookies = await page.context().cookies();
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page.getByTestId("signed-in-as")).toHaveCount(0);

  // The same cookie, replayed from elsewhere, opens nothing.
  const replay = await browser.newContext();
  await replay.addCookies(cookies);
  const again = await replay.newPage();
  await again.goto("/studio");
  await expect(again).toHaveURL(/\/sign-in/);
  expect((await again.request.get("/api/anthologies/low-tide-almanac/pieces")).status()).toBe(401);
  await replay.close();
});

test("changing the password signs out every other session", async ({ page, browser }) => {
  const email = uniqueEmail("hazel");
  await signUp(page, "Hazel Tirrell", email, "quarry-dusk-58");

  const other = await (await browser.newContext()).newPage();
  await signInWithPassword(other, email, "quarry-dusk-58");

  await page.getByTestId("signed-in-as").click();
  await expect(page).toHaveURL(/\/studio\/account$/);
  await page.locator("#current-password").fill("quarry-dusk-58");
  await page.locator("#new-password").fill("lantern-moss-71");
  await page.getByRole("button", { name: "Change password" }).click();
  await expect(page.getByTestId("password-outcome")).toContainText("Password changed");

  // This browser stays in; the other one is out.
  await page.goto("/studio");
  await expect(page.getByTestId("signed-in-as")).toHaveText(email);
  await other.goto("/studio");
  await expect(other).toHaveURL(/\/sign-in/);
  await signInWithPassword(other, email, "lantern-moss-71");
  await other.context().close();
});

test("an invitation opened by another account cannot be accepted by it", async ({
  page,
  browser,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto("/studio/low-tide-almanac/members");
  const invited = uniqueEmail("rosalind");
  await page.locator("#invite-email").fill(invited);
  await page.locator("#invite-role").selectOption("editor");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByTestId("invite-result")).toContainText(invited);
  const message = await waitForMessage({ to: invited, subject: /invited to Low Tide Almanac/ });
  const link = extractLinks(message.text).find((l) => l.includes("/invite/"))!;

  const imke = demoAccount("imke");
  const outsider = await (await browser.newContext()).newPage();
  await signInWithPassword(outsider, imke.email, imke.password);
  await outsider.goto(link);
  await expect(outsider.getByTestId("invitation-confirm")).toBeVisible();
  await expect(outsider.getByRole("button", { name: "Accept the invitation" })).toHaveCount(0);
  await outsider.context().close();

  // The lead sees it pending and withdraws it; the link then says so.
  await page.reload();
  await expect(page.getByTestId("pending-invitations")).toContainText(invited);
  const withdraw = page.getByRole("button", { name: `Withdraw the invitation to ${invited}` });
  await withdraw.click();
  await expect(withdraw).toHaveCount(0);
  await page.goto(link);
  await expect(page.getByTestId("invitation-problem")).toContainText("withdrawn");
});

test("a write from another site is refused even with a valid session cookie", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  const list = await page.request.get("/api/anthologies/low-tide-almanac/submissions?pageSize=5");
  const pieceId = ((await list.json()) as { rows: { id: number }[] }).rows[0]!.id;

  const forged = await page.request.post(`/api/pieces/${pieceId}/notes`, {
    headers: { origin: "https://attacker.example" },
    data: { body: "written from another site" },
  });
  expect(forged.status()).toBe(403);
  const notes = await page.request.get(`/api/pieces/${pieceId}/notes`);
  expect(JSON.stringify(await notes.json())).not.toContain("written from another site");

  const own = await page.request.post(`/api/pieces/${pieceId}/notes`, {
    headers: { origin: new URL(page.url()).origin },
    data: { body: "Trim the cover after scoring." },
  });
  expect(own.status()).toBe(201);
});
