import type { VisibilityState } from "@tanstack/react-table";
import { useEffect, useState } from "react";

const COLUMNS_KEY = "quireline.submissions.hidden-columns";

/** Which columns are shown, remembered in this browser (every column until the person hides some). */
export function useHiddenColumns() {
  const [columnVisibility, setColumnVisibility] = useState<VisibilityState>({});
  useEffect(() => {
    try {
      const hidden = JSON.parse(localStorage.getItem(COLUMNS_KEY) ?? "[]") as string[];
      setColumnVisibility(Object.fromEntries(hidden.map((id) => [id, false])));
    } catch {
      // A damaged setting just shows every column.
    }
  }, []);
  const toggleColumn = (id: string, on: boolean) => {
    setColumnVisibility((current) => {
      const next = { ...current, [id]: on };
      const hidden = Object.entries(next)
        .filter(([, visible]) => !visible)
        .map(([key]) => key);
      localStorage.setItem(COLUMNS_KEY, JSON.stringify(hidden));
      return next;
    });
  };
  return { columnVisibility, setColumnVisibility, toggleColumn };
}
