import type { Page } from "@playwright/test";

/**
 * Collects every Content-Security-Policy violation the page reports, from the DOM's
 * `securitypolicyviolation` event (CSP Level 3 §5.3) and from Chromium's console line
 * ("Refused to … because it violates the following Content Security Policy directive").
 * Call before the first navigation; read the array at the end of the test.
 */
export async function recordCspViolations(page: Page): Promise<string[]> {
  const seen: string[] = [];
  await page.exposeFunction("__quirelineCspViolation", (line: string) => seen.push(line));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (event) => {
      const report = `${event.violatedDirective} blocked ${event.blockedURI || "inline"} on ${location.pathname}`;
      (
        window as unknown as { __quirelineCspViolation: (s: string) => void }
      ).__quirelineCspViolation(report);
    });
  });
  page.on("console", (message) => {
    if (message.type() === "error" && message.text().includes("Content Security Policy"))
      seen.push(message.text());
  });
  return seen;
}
