import type { SlotReservation } from "@/lib/domain";

/** What a page can be kept for, in plain words, in the order the map screen offers them. */
export const RESERVATION_LABELS: Record<SlotReservation, string> = {
  cover: "Cover",
  "inside-cover": "Inside cover",
  contents: "Contents",
  credits: "Credits",
  colophon: "Colophon",
  ad: "Advert",
  blank: "Left blank",
};

/** The same, as they read inside a sentence: "Kept page 3 for the contents." */
export const RESERVATION_PHRASES: Record<SlotReservation, string> = {
  cover: "the cover",
  "inside-cover": "an inside cover",
  contents: "the contents",
  credits: "the credits",
  colophon: "the colophon",
  ad: "an advert",
  blank: "a blank page",
};
