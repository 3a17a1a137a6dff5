import { expect, test } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { recordCspViolations } from "./csp";
import { signInWithPassword } from "./helpers";

const slug = "low-tide-almanac";

test("pages answer with the security headers and a fresh nonce that their scripts carry", async ({
  page,
  request,
}) => {
  const first = await request.get("/");
  const second = await request.get("/");
  const csp = first.headers()["content-security-policy"] ?? "";
  expect(csp).toContain("frame-ancestors 'none'");
  expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+' 'strict-dynamic'/);
  expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
  const nonce = /'nonce-([^']+)'/.exec(csp)?.[1];
  const nonce2 = /'nonce-([^']+)'/.exec(second.headers()["content-security-policy"] ?? "")?.[1];
  expect(nonce).toBeTruthy();
  expect(nonce2).not.toBe(nonce);
  expect(first.headers()["x-content-type-options"]).toBe("nosniff");
  expect(first.headers()["referrer-policy"]).toBe("strict-origin-when-cross-origin");
  expect(first.headers()["permissions-policy"]).toContain("camera=()");
  // Served over plain http here, so no HSTS (RFC 6797 §7.2).
  expect(first.headers()["strict-transport-security"]).toBeUndefined();

  // Every script in the page carries this response's nonce (the browser hides the attribute's
  // value from the DOM, so it is read from the HTML).
  const html = await first.text();
  const scripts = html.match(/<script\b[^>]*>/g) ?? [];
  expect(scripts.length).toBeGreaterThan(0);
  for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);

  // A signed-out visit to the studio is redirected, with the headers too.
  const studio = await request.get("/studio", { maxRedirects: 0 });
  expect(studio.status()).toBe(307);
  expect(studio.headers()["content-security-policy"]).toContain("frame-ancestors 'none'");

  // And the page runs: the sign-in form works under the policy.
  const violations = await recordCspViolations(page);
  await page.goto("/sign-in");
  await expect(page.locator("#pw-email")).toBeVisible();
  expect(violations).toEqual([]);
});

test("no screen reports a CSP violation", async ({ page }) => {
  test.slow(); // a walk over every main screen
  const violations = await recordCspViolations(page);
  await page.goto("/");
  await expect(page.getByTestId("demo-accounts")).toBeVisible();
  await page.goto(`/calls/${slug}`);
  await expect(page.locator("h1")).toBeVisible();

  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  for (const path of ["", "/call", "/spec", "/members"]) {
    await page.goto(`/studio/${slug}${path}`);
    await expect(page.locator("h1")).toBeVisible();
  }
  await page.goto(`/studio/${slug}/submissions`);
  const rows = page.getByTestId("submission-row");
  await expect(rows.first()).toBeVisible();
  await rows.getByTestId("piece-link").first().click();
  await expect(page.getByTestId("piece-title")).toBeVisible();
  await page.goto(`/studio/${slug}/map`);
  await expect(page.getByTestId("map-screen")).toBeVisible();
  await page.getByTestId("view-sheets").click();
  await expect(page.getByTestId("view-sheets")).toHaveAttribute("aria-pressed", "true");
  // Client-side moves between screens run under the same policy.
  await page.getByRole("link", { name: "Submissions" }).first().click();
  await expect(rows.first()).toBeVisible();

  expect(violations, violations.join("\n")).toEqual([]);
});
