import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

export interface ChartSeries {
  key: string;
  label: string;
  /** A colour from the theme, e.g. `var(--color-leaf)`. */
  color: string;
}

export type WeeklyChartProps = {
  data: readonly Record<string, number | string>[];
  /** The field holding each point's label (a week's first day). */
  xKey: string;
  series: readonly ChartSeries[];
  kind: 'bar' | 'line';
  stacked?: boolean;
  formatValue: (value: number) => string;
  formatX: (value: string) => string;
};

/**
 * A chart of figures by week. Loaded only where it is drawn (the charting library is large); the
 * table beside every chart holds the same figures for readers who cannot see it.
 */
export default function WeeklyChart({ data, xKey, series, kind, stacked = false, formatValue, formatX }: WeeklyChartProps) {
  const axes = (
    <>
      <CartesianGrid stroke="var(--color-rule)" vertical={false} />
      <XAxis dataKey={xKey} tickFormatter={(value: string) => formatX(value)} stroke="var(--color-ink-muted)" fontSize={12} />
      <YAxis tickFormatter={(value: number) => formatValue(value)} stroke="var(--color-ink-muted)" fontSize={12} width={80} />
      <Tooltip formatter={(value) => formatValue(Number(value))} labelFormatter={(label) => formatX(String(label))} />
      <Legend />
    </>
  );
  return (
    <ResponsiveContainer width="100%" height={260}>
      {kind === 'bar' ? (
        <BarChart data={[...data]} accessibilityLayer={false}>
          {axes}
          {series.map((each) => (
            <Bar key={each.key} dataKey={each.key} name={each.label} fill={each.color} {...(stacked ? { stackId: 'total' } : {})} isAnimationActive={false} />
          ))}
        </BarChart>
      ) : (
        <LineChart data={[...data]} accessibilityLayer={false}>
          {axes}
          {series.map((each) => (
            <Line key={each.key} dataKey={each.key} name={each.label} stroke={each.color} strokeWidth={2} dot={false} isAnimationActive={false} />
          ))}
        </LineChart>
      )}
    </ResponsiveContainer>
  );
}
