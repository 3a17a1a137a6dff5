import { formatCents } from "@/lib/money";
import { OPTION_LABELS, type RunPlan } from "@/lib/run/plan";

const hours = (minutes: number) => `${Math.round((minutes / 60) * 10) / 10} h`;

/** For each quantity weighed: what our own run takes, and every option's total and per copy. */
export function CostTable({
  plan,
  currency,
  duplicator,
}: {
  plan: RunPlan;
  currency: string;
  duplicator: boolean;
}) {
  const money = (c: number) => formatCents(c, currency);
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Costs by quantity">
      <table className="w-full min-w-[40rem] text-left text-sm" data-testid="cost-table">
        <caption className="sr-only">
          Counts and costs for each quantity; the cheapest option is marked.
        </caption>
        <thead className="border-b border-ink/20 text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="py-2 pr-3">
              Copies
            </th>
            <th scope="col" className="py-2 pr-3">
              Sheets (cover)
            </th>
            <th scope="col" className="py-2 pr-3">
              {duplicator ? "Drum passes" : "Printed sides"}
            </th>
            {duplicator ? (
              <th scope="col" className="py-2 pr-3">
                Masters
              </th>
            ) : null}
            <th scope="col" className="py-2 pr-3">
              Staples
            </th>
            <th scope="col" className="py-2 pr-3">
              Spoilage
            </th>
            <th scope="col" className="py-2 pr-3">
              Finishing
            </th>
            {plan.comparison.options.map((o) => (
              <th key={o} scope="col" className="py-2 pr-3">
                {OPTION_LABELS[o]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {plan.rows.map((row) => {
            const home = row.options[0]!.run!;
            return (
              <tr
                key={row.copies}
                className="border-b border-ink/10 align-top"
                data-copies={row.copies}
              >
                <th scope="row" className="py-2 pr-3 font-semibold">
                  {row.copies}
                </th>
                <td className="py-2 pr-3">
                  {home.insideSheets}
                  {home.coverSheets > 0 ? ` (+${home.coverSheets})` : ""}
                </td>
                <td className="py-2 pr-3">
                  {duplicator ? home.passes : row.options[1]!.run!.printedSides}
                </td>
                {duplicator ? <td className="py-2 pr-3">{home.masters}</td> : null}
                <td className="py-2 pr-3">{home.staples}</td>
                <td className="py-2 pr-3">{row.spoilageSheets} sheets</td>
                <td className="py-2 pr-3">{hours(home.finishingMinutes)}</td>
                {row.options.map((o) => {
                  const cheapest = row.cheapest.includes(o.option);
                  return (
                    <td
                      key={o.option}
                      className={`py-2 pr-3 ${cheapest ? "font-semibold text-teal-dark" : ""}`}
                      data-option={o.option}
                    >
                      {money(o.totalCents)}
                      <span className="block text-xs text-ink-soft">
                        {money(o.perCopyCents)} a copy{cheapest ? " · cheapest" : ""}
                      </span>
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
