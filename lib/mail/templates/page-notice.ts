import { pagesInWords } from "@/lib/map/state";
import { composeMail, type Mail } from "../compose";

/** Tells a contributor on which pages of the map their accepted pieces sit. */
export function pageNoticeMail(input: {
  anthologyTitle: string;
  /** How to greet them: their name, or a neutral word, never their address. */
  greeting: string;
  pieces: { title: string; pages: number[] }[];
  link: string;
}): Mail {
  const lines = input.pieces.map((p) => `“${p.title}”: ${pagesInWords(p.pages)}`);
  return composeMail(
    `Your pages in ${input.anthologyTitle}`,
    [
      `Hello ${input.greeting}, the page map of ${input.anthologyTitle} puts your work here:`,
      ...lines.map((l) => `- ${l}`),
      "Page numbers can still change before printing; we will write again if they do.",
    ],
    { href: input.link, label: `Open ${input.anthologyTitle}` },
  );
}
