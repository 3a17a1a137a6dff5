import { composeMail, type Mail } from "../compose";

/** The e-mail with a one-time sign-in link (Auth.js makes the link and its expiry). */
export function signInLinkMail(url: string): Mail {
  return composeMail(
    "Your Quireline sign-in link",
    [
      "Open the link below to sign in to Quireline. It works once and expires in an hour.",
      "If you did not ask for it, ignore this message.",
    ],
    { href: url, label: "Sign in to Quireline" },
  );
}
