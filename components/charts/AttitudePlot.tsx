import { LinePlot, type PlotSeries } from './LinePlot';
import { plotColors } from './plot-colors';

/** Props of {@link AttitudePlot}. */
export interface AttitudePlotProps {
  /** Sample times, seconds. */
  t: readonly number[];
  /** Yaw, pitch, roll (z-y′-x″) at each time, degrees; yaw and roll unwrapped (may leave ±180°). */
  yawDeg: readonly number[];
  pitchDeg: readonly number[];
  rollDeg: readonly number[];
  /** Target yaw/pitch/roll in degrees, drawn as dashed lines when given. */
  target?: { yaw: number; pitch: number; roll: number } | null;
  /** Drawing height in px; default 200. */
  height?: number;
}

/** Yaw, pitch and roll of the body against time, with dashed target lines. */
export function AttitudePlot({ t, yawDeg, pitchDeg, rollDeg, target, height }: AttitudePlotProps) {
  const series: PlotSeries[] = [
    { name: 'Yaw', color: plotColors.yaw, values: yawDeg },
    { name: 'Pitch', color: plotColors.pitch, values: pitchDeg },
    { name: 'Roll', color: plotColors.roll, values: rollDeg },
  ];
  if (target) {
    series.push(
      { name: 'Target yaw', color: plotColors.yaw, values: t.map(() => target.yaw), dashed: true },
      { name: 'Target pitch', color: plotColors.pitch, values: t.map(() => target.pitch), dashed: true },
      { name: 'Target roll', color: plotColors.roll, values: t.map(() => target.roll), dashed: true },
    );
  }
  const last = t.length - 1;
  const summary =
    last < 0
      ? 'No samples.'
      : `Over ${t[last].toFixed(1)} s the body reaches yaw ${yawDeg[last].toFixed(1)}°, pitch ${pitchDeg[last].toFixed(1)}°, roll ${rollDeg[last].toFixed(1)}°` +
        (target ? ` (target ${target.yaw}°, ${target.pitch}°, ${target.roll}°).` : '.');
  return <LinePlot title="Attitude vs time" summary={summary} x={t} series={series} yUnit="°" height={height} testID="attitude-plot" />;
}
