import { useMemo } from 'react';

import { quatToYpr } from '@/shared/math/euler-zyx';
import type { SimulationResult } from '@/shared/contracts/result';
import { LinePlot, type PlotSeries } from './LinePlot';
import { plotColors } from './plot-colors';
import { unwrapDegrees } from './plot-scale';

const DEG = 180 / Math.PI;

/** Props of {@link AttitudePlot}. */
export interface AttitudePlotProps {
  /** The verification result's samples (attitude {w,x,y,z} body → inertial per frame). */
  samples: SimulationResult['samples'];
  /** Target yaw/pitch/roll in degrees, drawn as dashed lines when given. */
  target?: { yaw: number; pitch: number; roll: number } | null;
  /** Drawing height in px; default 200. */
  height?: number;
}

/** Yaw, pitch and roll of the body (z-y′-x″, degrees) against time, with dashed target lines. */
export function AttitudePlot({ samples, target, height }: AttitudePlotProps) {
  const { t, yaw, pitch, roll } = useMemo(() => {
    const ypr = samples.frames.map((f) => quatToYpr([f.attitude.w, f.attitude.x, f.attitude.y, f.attitude.z]));
    return {
      t: samples.frames.map((f) => f.t),
      // Yaw and roll wrap at ±180°: unwrap so a turn past 180° draws as one line.
      yaw: unwrapDegrees(ypr.map((a) => a.yaw * DEG)),
      pitch: ypr.map((a) => a.pitch * DEG),
      roll: unwrapDegrees(ypr.map((a) => a.roll * DEG)),
    };
  }, [samples]);
  const series: PlotSeries[] = [
    { name: 'Yaw', color: plotColors.yaw, values: yaw },
    { name: 'Pitch', color: plotColors.pitch, values: pitch },
    { name: 'Roll', color: plotColors.roll, values: roll },
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
      : `Over ${t[last].toFixed(1)} s the body reaches yaw ${yaw[last].toFixed(1)}°, pitch ${pitch[last].toFixed(1)}°, roll ${roll[last].toFixed(1)}°` +
        (target ? ` (target ${target.yaw}°, ${target.pitch}°, ${target.roll}°).` : '.');
  return <LinePlot title="Attitude vs time" summary={summary} x={t} series={series} yUnit="°" height={height} testID="attitude-plot" />;
}
