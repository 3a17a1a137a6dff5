import { Notice } from "@/components/ui/notice";
import type { SpecImpact } from "@/lib/wire/spec-change";

const GROUPS = [
  {
    severity: "refusal",
    tone: "error",
    title: "This change cannot be saved",
    lead: "Change these first:",
  },
  {
    severity: "warning",
    tone: "warn",
    title: "This change needs your confirmation",
    lead: "Saving it means:",
  },
  { severity: "note", tone: "info", title: "Good to know", lead: "" },
] as const;

/** What a spec change would break or cost, grouped as refusals, warnings and notes. */
export function SpecImpacts({ impacts }: { impacts: SpecImpact[] }) {
  return (
    <div className="flex flex-col gap-3" data-testid="spec-impacts">
      {GROUPS.map((group) => {
        const items = impacts.filter((i) => i.severity === group.severity);
        if (items.length === 0) return null;
        return (
          <Notice
            key={group.severity}
            tone={group.tone}
            title={group.title}
            testId={`spec-impacts-${group.severity}`}
          >
            {group.lead ? <p className="mb-2">{group.lead}</p> : null}
            <ul className="flex list-disc flex-col gap-1 pl-5">
              {items.map((item, n) => (
                <li key={`${item.code}-${n}`} data-testid="spec-impact" data-code={item.code}>
                  {item.message}
                </li>
              ))}
            </ul>
          </Notice>
        );
      })}
    </div>
  );
}
