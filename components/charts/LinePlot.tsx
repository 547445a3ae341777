import { useState } from 'react';
import { type LayoutChangeEvent, StyleSheet, View } from 'react-native';

import { fonts, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

import { plotColors } from './plot-colors';
import { formatTick, linearScale, niceDomain, polylinePath } from './plot-scale';

/** One line of a {@link LinePlot}. */
export interface PlotSeries {
  /** Legend name, e.g. "Yaw". */
  name: string;
  /** CSS colour. */
  color: string;
  /** One value per entry of the plot's `x`, in the plot's y unit. */
  values: readonly number[];
  /** Dashed line (e.g. a target). */
  dashed?: boolean;
}

/** A horizontal band between two y values (e.g. a joint's allowed range). */
export interface PlotBand {
  lo: number;
  hi: number;
}

/** A stretch of x to highlight (e.g. the time a joint spends beyond its limit). */
export interface PlotSpan {
  from: number;
  to: number;
}

/** Props of {@link LinePlot}. */
export interface LinePlotProps {
  /** Accessible name of the figure and its visible caption. */
  title: string;
  /** A sentence read by screen readers in place of the drawing (what the lines show, key numbers). */
  summary: string;
  /** x values (seconds), ascending. */
  x: readonly number[];
  series: readonly PlotSeries[];
  /** Unit of the y axis, e.g. "°". */
  yUnit: string;
  /** Unit of the x axis; default "s". */
  xUnit?: string;
  /** Shaded band behind the lines, kept inside the y domain. */
  band?: PlotBand;
  /** Highlighted x stretches, drawn as red bars along the bottom. */
  spans?: readonly PlotSpan[];
  /** Drawing height in px; default 200. */
  height?: number;
  /** Hide the legend row (e.g. a single series named by the title); default false. */
  hideLegend?: boolean;
  testID?: string;
}

const PAD = { left: 44, right: 10, top: 10, bottom: 26 };

/**
 * A line chart drawn as an inline `<svg>` (react-native-web renders DOM elements; the app targets the
 * web only). It measures its own width so labels keep their pixel size on a phone and a monitor.
 * Exposed to assistive technology as one image with a text summary.
 */
export function LinePlot({ title, summary, x, series, yUnit, xUnit = 's', band, spans, height = 200, hideLegend = false, testID }: LinePlotProps) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));

  // y domain covers every series and the band, widened to nice ticks.
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of series) for (const v of s.values) if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  if (band) { lo = Math.min(lo, band.lo); hi = Math.max(hi, band.hi); }
  const yAxis = niceDomain(lo, hi, height < 150 ? 3 : 5);
  const xAxis = niceDomain(x[0] ?? 0, x[x.length - 1] ?? 1, width < 420 ? 4 : 8);
  const xs = linearScale([x[0] ?? 0, x[x.length - 1] ?? 1], [PAD.left, Math.max(PAD.left + 1, width - PAD.right)]);
  const ys = linearScale(yAxis.domain, [height - PAD.bottom, PAD.top]);
  const px = x.map(xs);
  const xTicks = xAxis.ticks.filter((t) => t >= xs.domain[0] - 1e-9 && t <= xs.domain[1] + 1e-9);

  return (
    <View style={styles.wrap} testID={testID}>
      <Text variant="label">{title}</Text>
      <View onLayout={onLayout} style={{ height }}>
        {width > 0 ? (
          <svg width={width} height={height} role="img" aria-label={`${title}. ${summary}`} style={{ display: 'block' }}>
            <title>{`${title}. ${summary}`}</title>
            {band ? (
              <g>
                <rect x={PAD.left} width={width - PAD.left - PAD.right} y={ys(band.hi)} height={Math.max(0, ys(band.lo) - ys(band.hi))} fill={plotColors.band} />
                <line x1={PAD.left} x2={width - PAD.right} y1={ys(band.hi)} y2={ys(band.hi)} stroke={plotColors.bandEdge} strokeDasharray="4 3" />
                <line x1={PAD.left} x2={width - PAD.right} y1={ys(band.lo)} y2={ys(band.lo)} stroke={plotColors.bandEdge} strokeDasharray="4 3" />
              </g>
            ) : null}
            {yAxis.ticks.map((t) => (
              <g key={`y${t}`}>
                <line x1={PAD.left} x2={width - PAD.right} y1={ys(t)} y2={ys(t)} stroke={plotColors.grid} />
                <text x={PAD.left - 6} y={ys(t) + 4} textAnchor="end" fill={plotColors.axisText} fontSize={11} fontFamily={fonts.regular}>
                  {`${formatTick(t)}${yUnit}`}
                </text>
              </g>
            ))}
            {xTicks.map((t) => (
              <text key={`x${t}`} x={xs(t)} y={height - 8} textAnchor="middle" fill={plotColors.axisText} fontSize={11} fontFamily={fonts.regular}>
                {`${formatTick(t)} ${xUnit}`}
              </text>
            ))}
            {spans?.map((s, i) => (
              <rect key={`s${i}`} x={xs(s.from)} width={Math.max(2, xs(s.to) - xs(s.from))} y={height - PAD.bottom - 4} height={4} fill={plotColors.violation} />
            ))}
            {series.map((s) => (
              <path
                key={s.name}
                d={polylinePath(px, s.values.map(ys))}
                fill="none"
                stroke={s.color}
                strokeWidth={s.dashed ? 1.25 : 1.75}
                strokeDasharray={s.dashed ? '5 4' : undefined}
                strokeLinejoin="round"
              />
            ))}
          </svg>
        ) : null}
      </View>
      {hideLegend ? null : (
        <View style={styles.legend} aria-hidden>
          {series.map((s) => (
            <View key={s.name} style={styles.legendItem}>
              <View style={[styles.swatch, { backgroundColor: s.color }, s.dashed && styles.swatchDashed]} />
              <Text variant="caption" tone="muted">
                {s.name}
              </Text>
            </View>
          ))}
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, alignSelf: 'stretch' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs },
  swatch: { width: 14, height: 3, borderRadius: 2 },
  swatchDashed: { opacity: 0.6 },
});
