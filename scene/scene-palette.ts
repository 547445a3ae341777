/**
 * Colours of the 3D view (CSS hex strings), chosen to read on the cabin-night background:
 * the person's left side teal, right side amber, midline a pale slate; body axes x/y/z in coral,
 * mint and sky; the target ghost violet.
 */
export const scenePalette = {
  /** Canvas clear colour (matches the app background). */
  background: '#0B121B',
  /** Segments on the person's left (teal), right (amber) and midline (slate). */
  left: '#3CC8BA',
  right: '#F5A440',
  centre: '#B9C6D3',
  /** Joint balls. */
  joint: '#5B6F84',
  /** Face marker on the head's anterior side. */
  visor: '#1B2B3F',
  /** Body axes triad: x anterior, y left, z toward the head. */
  axisX: '#FF7A66',
  axisY: '#8BE39B',
  axisZ: '#71B7FF',
  /** Target attitude ghost and its markers. */
  ghost: '#B49CFF',
  /** Head-axis trail. */
  trail: '#FFD98A',
  /** Inertial grid lines and stars. */
  grid: '#22364A',
  gridCentre: '#2F4A63',
  star: '#9FB3C8',
  /** Beat ring. */
  beat: '#FFB454',
} as const;
