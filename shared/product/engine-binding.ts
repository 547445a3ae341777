/**
 * How screens and the printed cue card name the engine version an approval binds to, and say when
 * the server now runs another one (the verified result stays what is rehearsed). One wording for all.
 */

/** Engine version shortened for display: the semver plus the first 8 characters of the source hash. */
export function shortEngineVersion(v: string): string {
  const [semver, hash] = v.split('+');
  return hash ? `${semver}+${hash.slice(0, 8)}` : semver;
}

/** "Verified by engine …", plus a sentence when the running engine differs. */
export function engineBindingText(verified: string, running: string): string {
  const head = `Verified by engine ${shortEngineVersion(verified)}.`;
  if (verified === running) return head;
  return `${head} This server now runs engine ${shortEngineVersion(running)}; what you see is the verified result, and the approval stays bound to the engine that verified it.`;
}
