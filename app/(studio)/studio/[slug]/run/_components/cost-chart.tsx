"use client";

import {
  CartesianGrid,
  Legend,
  Line,
  LineChart,
  ReferenceLine,
  ResponsiveContainer,
  Tooltip,
  XAxis,
  YAxis,
} from "recharts";
import { formatCents } from "@/lib/money";
import { OPTION_LABELS, type OptionId, type RunPlan } from "@/lib/run/plan";

/** One colour per option; all three keep AA contrast on the paper background. */
const COLOURS: Record<OptionId, string> = {
  home: "#1d4f4c",
  "copy-shop": "#9e3f2b",
  shop: "#1f2a24",
};
const DASHES: Record<OptionId, string | undefined> = {
  home: undefined,
  "copy-shop": "6 3",
  shop: "2 3",
};

/**
 * Cost per copy against quantity for each option, with the break-even quantities drawn as
 * vertical lines. The sentence and the table under it carry the same figures in words.
 */
export function CostChart({ plan, currency }: { plan: RunPlan; currency: string }) {
  const { comparison, chart } = plan;
  const money = (c: number) => formatCents(Math.round(c), currency);
  return (
    <figure className="flex flex-col gap-2" aria-labelledby="cost-chart-title">
      <figcaption id="cost-chart-title" className="text-sm font-semibold">
        Cost per copy by quantity, 1 to {comparison.maxCopies.toLocaleString("en-US")} copies
        (per-copy axis on a log scale)
      </figcaption>
      <div className="h-72 w-full" data-testid="cost-chart">
        <ResponsiveContainer width="100%" height="100%">
          <LineChart
            data={chart}
            margin={{ top: 8, right: 16, bottom: 8, left: 8 }}
            title="Cost per copy by quantity"
            desc={comparison.summary}
          >
            <CartesianGrid stroke="#d9cfb8" strokeDasharray="3 3" />
            <XAxis
              dataKey="copies"
              type="number"
              domain={[1, comparison.maxCopies]}
              tick={{ fill: "#4a5249", fontSize: 12 }}
              label={{
                value: "copies",
                position: "insideBottomRight",
                offset: -4,
                fill: "#4a5249",
              }}
            />
            <YAxis
              scale="log"
              domain={["auto", "auto"]}
              allowDataOverflow
              width={72}
              tick={{ fill: "#4a5249", fontSize: 12 }}
              tickFormatter={money}
            />
            <Tooltip
              formatter={(value, name) => [money(Number(value)), String(name)]}
              labelFormatter={(q) => `${q} copies`}
            />
            <Legend wrapperStyle={{ fontSize: 12 }} />
            {comparison.options.map((o) => (
              <Line
                key={o}
                dataKey={o}
                name={OPTION_LABELS[o]}
                stroke={COLOURS[o]}
                strokeDasharray={DASHES[o]}
                strokeWidth={2}
                dot={false}
                isAnimationActive={false}
              />
            ))}
            {comparison.breakEvens.map((b) => (
              <ReferenceLine
                key={b.copies}
                x={b.copies}
                stroke="#b74a34"
                label={{ value: `${b.copies}`, position: "top", fill: "#9e3f2b", fontSize: 12 }}
              />
            ))}
          </LineChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}
