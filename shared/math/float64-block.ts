/**
 * Several Float64Arrays carved from one ArrayBuffer: one allocation where a work or pose set needs a
 * dozen small arrays (each `new Float64Array` is a separate buffer, about three times the cost of a
 * view; the engine's search mode makes such sets for every simulation). Zero-filled, like new arrays.
 */

/** Float64Arrays of the given lengths, in order, sharing one buffer. */
export function float64Block(lengths: readonly number[]): Float64Array[] {
  let total = 0;
  for (const n of lengths) total += n;
  const buffer = new ArrayBuffer(8 * total);
  const out = new Array<Float64Array>(lengths.length);
  let offset = 0;
  for (let i = 0; i < lengths.length; i++) {
    out[i] = new Float64Array(buffer, 8 * offset, lengths[i]);
    offset += lengths[i];
  }
  return out;
}
