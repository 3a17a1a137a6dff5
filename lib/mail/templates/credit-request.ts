import { composeMail, type Mail } from "../compose";

/**
 * Asks a contributor to approve their credit line as it will print. The link is the key: it works
 * without signing in, for this piece and this wording only, for `days` days.
 */
export function creditRequestMail(input: {
  anthologyTitle: string;
  /** Their name, or a neutral word; never their address. */
  greeting: string;
  pieceTitle: string;
  creditLine: string;
  link: string;
  days: number;
  /** True when the line changed after an earlier approval. */
  again: boolean;
}): Mail {
  return composeMail(
    `${input.again ? "Approve your changed credit" : "Approve your credit"} in ${input.anthologyTitle}`,
    [
      `Hello ${input.greeting},`,
      input.again
        ? `The credit line for “${input.pieceTitle}” changed after you approved it, so we are asking again. It will now print as:`
        : `Before ${input.anthologyTitle} goes to print, please check how you will be credited for “${input.pieceTitle}”. It will print as:`,
      input.creditLine,
      "Open the link to approve it as it is, or change it and approve the new wording. Nothing prints until you do.",
      `The link is only for this piece and this wording, and lasts ${input.days} days.`,
    ],
    { href: input.link, label: "Check your credit line" },
  );
}
