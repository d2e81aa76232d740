"use client";

import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

/** API requests per minute over the last hour (recharts). */
export function RequestsChart({ data }: { data: { minute: string; n: number }[] }) {
  if (!data.some((d) => d.n > 0)) return <p className="text-sm text-ink-muted">No API requests in the last hour.</p>;
  const rows = data.map((d) => ({ time: d.minute.slice(11, 16), requests: d.n }));
  return (
    <div className="h-40" role="img" aria-label="API requests per minute over the last hour">
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={rows} margin={{ top: 4, right: 4, bottom: 0, left: -20 }}>
          <CartesianGrid stroke="#eceef1" vertical={false} />
          <XAxis dataKey="time" tick={{ fontSize: 11, fill: "#5b6573" }} />
          <YAxis allowDecimals={false} tick={{ fontSize: 11, fill: "#5b6573" }} />
          <Tooltip cursor={{ fill: "#f6f7f8" }} />
          <Bar dataKey="requests" fill="#0f8a8f" isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
