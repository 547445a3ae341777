/** A 3-vector [x, y, z]; metres unless stated. */
export type Vec3 = [number, number, number];
