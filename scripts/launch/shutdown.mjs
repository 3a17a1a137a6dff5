// Stopping everything a run started, on a signal, an error or the end of the tests: the app
// first, the print worker, the fakes, the print queue's Redis (reverse start order), the
// database last.

import * as mariadb from "../mariadb.mjs";
import { note, step } from "./common.mjs";
import { db } from "./database.mjs";
import { running, stopGroup } from "./processes.mjs";

/** Set once stopping has begun; the promise settles when everything is stopped. */
export let shuttingDown = null;
/** Whether a signal started the stop. */
export let signalled = false;

export function shutdown(reason) {
  if (shuttingDown) return shuttingDown;
  shuttingDown = (async () => {
    if (reason) step(reason);
    // The app first, the fakes next (reverse start order), the database last.
    for (const entry of [...running].reverse()) await stopGroup(entry);
    if (db.private) {
      try {
        const stopped = await mariadb.leave();
        if (stopped) note("stopped the private MariaDB");
      } catch (err) {
        note(`could not stop the private MariaDB: ${err.message}`);
      }
    }
  })();
  return shuttingDown;
}

/** Ctrl-C, kill and a closed terminal stop everything this run started, then exit. */
export function handleSignals() {
  for (const sig of ["SIGINT", "SIGTERM", "SIGHUP"]) {
    process.on(sig, () => {
      if (signalled) {
        note("still stopping; please wait");
        return;
      }
      signalled = true;
      console.log("");
      shutdown(`${sig} received: stopping everything this run started`).then(() =>
        process.exit(sig === "SIGINT" ? 130 : 143),
      );
    });
  }
}
