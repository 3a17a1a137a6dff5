// node_modules from the lock file, Debian's Chromium for Playwright and poppler's pdfinfo,
// pdftotext and pdftoppm, the independent PDF reader the print-file tests check against.

import fs from "node:fs";
import path from "node:path";

import * as mariadb from "../mariadb.mjs";
import { Fatal, isRoot, ROOT, step } from "./common.mjs";
import { runToEnd } from "./processes.mjs";

function mtime(file) {
  try {
    return fs.statSync(file).mtimeMs;
  } catch {
    return null;
  }
}

export async function installDependencies(mode, wantPlaywright) {
  const nm = path.join(ROOT, "node_modules");
  const lock = path.join(ROOT, "package-lock.json");
  const hasLock = fs.existsSync(lock);
  let why = null;
  if (!fs.existsSync(nm)) why = "node_modules is missing";
  else if (hasLock) {
    const installed = mtime(path.join(nm, ".package-lock.json"));
    if (installed === null) why = "node_modules was not installed from the lock file";
    else if (mtime(lock) > installed) why = "package-lock.json changed since the last install";
  }
  if (why) {
    const args = hasLock
      ? ["ci", "--no-audit", "--no-fund"]
      : ["install", "--no-audit", "--no-fund"];
    step(`installing packages (${why}): npm ${args.join(" ")}`);
    const r = await runToEnd("npm", "npm", args, { env: process.env });
    if (r.code !== 0)
      throw new Fatal(`npm ${args[0]} failed (exit ${r.code ?? r.signal ?? r.error?.message})`);
  } else {
    step("packages are installed");
  }

  if (mode === "test" && wantPlaywright && !fs.existsSync("/usr/bin/chromium")) {
    if (!isRoot) {
      throw new Fatal(
        "Playwright needs Debian's Chromium at /usr/bin/chromium. Install it as root:\n" +
          "  apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends chromium",
      );
    }
    step("installing Debian's chromium for Playwright");
    mariadb.aptInstall(["chromium"]);
  }
}

/** poppler-utils for the print-file tests (root installs it; others are told how). */
export function installPdfTools(mode) {
  if (mode !== "test" || fs.existsSync("/usr/bin/pdfinfo")) return;
  if (!isRoot) {
    throw new Fatal(
      "The print-file tests read PDFs back with poppler's pdfinfo and pdftoppm. Install them as root:\n" +
        "  apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends poppler-utils",
    );
  }
  step("installing Debian's poppler-utils for the print-file tests");
  mariadb.aptInstall(["poppler-utils"]);
}
