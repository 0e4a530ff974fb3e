/**
 * The two charts a person would rather look at than read: energy stored per spark across the rev
 * range, and the voltage available at the plug against the voltage the plug needs, with the margin
 * shown as a band. The ignition fitted now and each plan keep one style (colour, dash and marker)
 * on both charts and on the cards.
 */
import { memo, type ReactNode } from 'react';
import type { ShownSetup } from '../../../electron/ipc/channels.js';
import { LineChart, type ChartLine } from '../../charts/LineChart.js';
import { requiredStyle, styleFor } from '../../charts/palette.js';
import { number } from './words.js';

const label = (s: ShownSetup): string => (s.kind === 'existing' ? 'Fitted now' : s.name);

/** True when two columns agree within 0.5 % everywhere (same plug gap and polarity: one requirement). */
function same(a: readonly number[], b: readonly number[]): boolean {
  if (a.length !== b.length) return false;
  return a.every((v, i) => Math.abs(v - b[i]!) <= 0.005 * Math.max(Math.abs(v), Math.abs(b[i]!), 1e-9));
}

export const WeighCharts = memo(function WeighCharts({ setups, margin }: { setups: readonly ShownSetup[]; margin: number }): ReactNode {
  const first = setups[0];
  if (!first) return null;
  const x = first.series.rpm;
  const from = first.series.crankingCount;
  const usable = setups.filter((s) => s.series.rpm.length === x.length);

  const energy: ChartLine[] = usable.map((s, i) => ({ id: `energy-${i}`, label: label(s), y: s.series.energyMj, style: styleFor(i), lineFrom: from }));
  const available: ChartLine[] = usable.map((s, i) => ({ id: `available-${i}`, label: `${label(s)}: available`, y: s.series.availableKv, style: styleFor(i), lineFrom: from }));

  // One "needed" line when every setup needs the same; otherwise one per setup, thin, in its colour.
  const distinct: Array<{ setup: ShownSetup; index: number }> = [];
  usable.forEach((s, i) => {
    if (!distinct.some((d) => same(d.setup.series.requiredKv, s.series.requiredKv))) distinct.push({ setup: s, index: i });
  });
  const required: ChartLine[] =
    distinct.length === 1
      ? [{ id: 'required', label: 'Needed at the plug', y: first.series.requiredKv, style: { ...requiredStyle, dashWords: 'thin grey line' }, lineFrom: from }]
      : distinct.map(({ setup, index }) => {
          const st = styleFor(index);
          return { id: `required-${index}`, label: `${label(setup)}: needed`, y: setup.series.requiredKv, style: { stroke: st.stroke, dash: '2 3', width: 1.6, dashWords: 'thin dotted line' }, lineFrom: from };
        });

  const highest = x.map((_, i) => Math.max(...usable.map((s) => s.series.requiredKv[i] ?? 0)));
  const band = { label: `Margin: ${number(margin, 2)} × what the plug needs (available should stay above the band)`, lower: highest, upper: highest.map((v) => v * margin), from };

  // Where a module does not switch the lines drop to 0: say why under the charts.
  const noSpark = usable.flatMap((s) => (s.series.noSparkNote ? [`${label(s)}: ${s.series.noSparkNote}`] : []));

  return (
    <div className="charts" data-testid="charts">
      {noSpark.length > 0 ? (
        <ul className="no-spark-notes" data-testid="no-spark-notes">
          {noSpark.map((t) => (
            <li key={t}>
              <strong>No spark:</strong> {t}
            </li>
          ))}
        </ul>
      ) : null}
      <LineChart
        title="Energy stored per spark"
        description="Across the rev range, from cranking speed to 10 % past redline. The lone marks at the far left are cranking, on the cranking supply."
        x={x}
        xLabel="Engine speed"
        xUnit="rpm"
        yLabel="Energy"
        yUnit="mJ"
        lines={energy}
        digits={1}
        testId="energy-chart"
      />
      <LineChart
        title="Voltage available against voltage needed"
        description={`The plug fires when the coil can offer more than the gap needs; ${number(margin, 2)} times as much is the usual reserve (common practice). Shaded: from what the plug needs to ${number(margin, 2)} times that.`}
        x={x}
        xLabel="Engine speed"
        xUnit="rpm"
        yLabel="Voltage"
        yUnit="kV"
        lines={[...available, ...required]}
        band={band}
        digits={1}
        testId="voltage-chart"
      />
    </div>
  );
});
