// Reads the form-encoded bodies the payments SDK sends (`metadata[entry]=7`,
// `enabled_events[0]=transfer.created`) into nested objects, and compares two parameter sets.

/** "a[b][c]" → ["a", "b", "c"]. */
function keyPath(key) {
  const head = /^[^[]+/.exec(key)?.[0] ?? key;
  const rest = [...key.slice(head.length).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1]);
  return [head, ...rest];
}

/** Parses application/x-www-form-urlencoded text into nested objects; numeric keys make arrays. */
export function parseForm(text) {
  const out = {};
  for (const [key, value] of new URLSearchParams(text)) {
    const path = keyPath(key);
    let node = out;
    path.forEach((part, i) => {
      const last = i === path.length - 1;
      const nextIsIndex = !last && /^\d*$/.test(path[i + 1]);
      if (Array.isArray(node) && part === "") part = String(node.length);
      if (last) node[part] = value;
      else node = node[part] ??= nextIsIndex ? [] : {};
    });
  }
  return out;
}

/** A stable text form of parameters, so "same body" means the same parameters in any order. */
export function canonical(value) {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value && typeof value === "object")
    return `{${Object.keys(value)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical(value[k])}`)
      .join(",")}}`;
  return JSON.stringify(value);
}
