import type { KeyboardEvent } from "react";

/** Arrow keys move focus to the same column's control in the next or previous row. */
export function moveBetweenRows(event: KeyboardEvent<HTMLTableElement>) {
  if (event.key !== "ArrowDown" && event.key !== "ArrowUp") return;
  const target = event.target as HTMLElement;
  if (target.tagName === "SELECT" || target.tagName === "TEXTAREA") return;
  const cell = target.closest("td, th");
  const row = cell?.parentElement as HTMLTableRowElement | null;
  if (!cell || !row) return;
  const rows = Array.from(event.currentTarget.querySelectorAll<HTMLTableRowElement>("tr"));
  const next = rows[rows.indexOf(row) + (event.key === "ArrowDown" ? 1 : -1)];
  const column = Array.from(row.children).indexOf(cell);
  const focusable = next?.children[column]?.querySelector<HTMLElement>("a, button, input");
  if (focusable) {
    event.preventDefault();
    focusable.focus();
  }
}
