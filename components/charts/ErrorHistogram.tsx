import { useState } from 'react';
import { type LayoutChangeEvent,StyleSheet, View } from 'react-native';

import { colors, fonts, spacing } from '@/components/theme';
import { Text } from '@/components/ui/Text';

import { histogramBins } from './histogram-bins';
import { plotColors } from './plot-colors';
import { formatTick, linearScale, niceDomain } from './plot-scale';

/** Props of {@link ErrorHistogram}. */
export interface ErrorHistogramProps {
  /** Final attitude error of every sample, degrees. */
  errorsDeg: readonly number[];
  /** The version's tolerance, degrees: drawn as a vertical line. */
  toleranceDeg: number;
  /** 50th and 95th percentiles, degrees: drawn as thin dashed lines. */
  p50Deg: number | null;
  p95Deg: number | null;
  /** Drawing height in px; default 170. */
  height?: number;
}

const PAD = { left: 40, right: 10, top: 14, bottom: 26 };

/**
 * Histogram of the final error of every robustness sample (with feedback) with the tolerance
 * marked, as an inline `<svg>` like the report's line plots; one image with a text summary for
 * assistive technology.
 */
export function ErrorHistogram({ errorsDeg, toleranceDeg, p50Deg, p95Deg, height = 170 }: ErrorHistogramProps) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));
  const { edges, counts, beyond } = histogramBins(errorsDeg, toleranceDeg);
  const hi = edges[edges.length - 1];
  const within = errorsDeg.filter((e) => e <= toleranceDeg).length;
  const yAxis = niceDomain(0, Math.max(1, ...counts), 4);
  const xAxis = niceDomain(0, hi, width < 420 ? 4 : 8);
  const xs = linearScale([0, hi], [PAD.left, Math.max(PAD.left + 1, width - PAD.right)]);
  const ys = linearScale(yAxis.domain, [height - PAD.bottom, PAD.top]);
  const summary = `${errorsDeg.length} samples; ${within} (${Math.round((100 * within) / Math.max(1, errorsDeg.length))} %) end within the ${toleranceDeg}° tolerance` +
    (p95Deg !== null ? `; 95th percentile ${p95Deg.toFixed(1)}°` : '') + (beyond ? `; ${beyond} beyond ${formatTick(hi)}° counted in the last bar.` : '.');
  const marker = (x: number, color: string, label: string, dashed: boolean, row: number) => (
    <g key={label}>
      <line x1={xs(x)} x2={xs(x)} y1={PAD.top - 4} y2={height - PAD.bottom} stroke={color} strokeWidth={dashed ? 1.25 : 2} strokeDasharray={dashed ? '4 3' : undefined} />
      <text x={Math.min(xs(x) + 4, width - PAD.right - 4)} y={PAD.top + 8 + row * 13} textAnchor={xs(x) > width - 90 ? 'end' : 'start'} fill={color} fontSize={11} fontFamily={fonts.regular}>
        {label}
      </text>
    </g>
  );
  return (
    <View style={styles.wrap} testID="robustness-histogram">
      <Text variant="label">Final error with feedback, all samples</Text>
      <View onLayout={onLayout} style={{ height }}>
        {width > 0 ? (
          <svg width={width} height={height} role="img" aria-label={`Histogram of the final error. ${summary}`} style={{ display: 'block' }}>
            <title>{`Histogram of the final error. ${summary}`}</title>
            {yAxis.ticks.map((t) => (
              <g key={`y${t}`}>
                <line x1={PAD.left} x2={width - PAD.right} y1={ys(t)} y2={ys(t)} stroke={plotColors.grid} />
                <text x={PAD.left - 6} y={ys(t) + 4} textAnchor="end" fill={plotColors.axisText} fontSize={11} fontFamily={fonts.regular}>{formatTick(t)}</text>
              </g>
            ))}
            {xAxis.ticks.filter((t) => t <= hi + 1e-9).map((t) => (
              <text key={`x${t}`} x={xs(t)} y={height - 8} textAnchor="middle" fill={plotColors.axisText} fontSize={11} fontFamily={fonts.regular}>{`${formatTick(t)}°`}</text>
            ))}
            {counts.map((c, k) => (
              <rect
                key={`b${k}`}
                x={xs(edges[k]) + 0.5}
                width={Math.max(1, xs(edges[k + 1]) - xs(edges[k]) - 1)}
                y={ys(c)}
                height={Math.max(0, ys(0) - ys(c))}
                fill={edges[k + 1] <= toleranceDeg + 1e-12 ? colors.success : edges[k] >= toleranceDeg ? colors.accent : colors.teal}
                opacity={0.75}
              />
            ))}
            {marker(toleranceDeg, colors.danger, `tolerance ${formatTick(toleranceDeg)}°`, false, 0)}
            {p50Deg !== null ? marker(p50Deg, colors.text, 'p50', true, 1) : null}
            {p95Deg !== null ? marker(p95Deg, colors.text, 'p95', true, 2) : null}
          </svg>
        ) : null}
      </View>
      <Text variant="caption" tone="muted">{summary}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs, alignSelf: 'stretch' },
});
