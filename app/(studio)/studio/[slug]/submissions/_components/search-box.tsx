"use client";

import { useEffect, useRef, useState } from "react";
import { inputClass } from "@/components/ui/field";

/** The search field: searches 300 ms after typing stops, or at once on Enter. */
export function SearchBox({ value, onSearch }: { value: string; onSearch: (q: string) => void }) {
  const [text, setText] = useState(value);
  const latest = useRef(onSearch);
  latest.current = onSearch;
  // Follow the address when it changes from outside (clear filters, back button).
  useEffect(() => setText(value), [value]);
  useEffect(() => {
    if (text.trim() === value) return;
    const timer = setTimeout(() => latest.current(text.trim()), 300);
    return () => clearTimeout(timer);
  }, [text, value]);
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor="submissions-search" className="text-sm font-semibold">
        Search
      </label>
      <input
        id="submissions-search"
        type="search"
        value={text}
        onChange={(event) => setText(event.target.value)}
        onKeyDown={(event) => {
          if (event.key === "Enter") latest.current(text.trim());
        }}
        placeholder="Title, contributor or credit line"
        maxLength={200}
        className={`${inputClass} w-72`}
      />
    </div>
  );
}
