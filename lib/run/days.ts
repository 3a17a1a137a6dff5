/**
 * Calendar days of the run (YYYY-MM-DD, already in the anthology's zone) written for people
 * through lib/dates.ts: noon UTC of the day, shown in UTC, is that same day.
 */
import { formatDate } from "@/lib/dates";

export function dayLabel(day: string): string {
  return formatDate(new Date(`${day}T12:00:00Z`), "UTC");
}
