/**
 * The fonts a cue card is set in: the app's Inter (regular and semibold TTFs shipped with
 * @expo-google-fonts/inter), or PDF's built-in Helvetica when those files cannot be found.
 */
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

/** Font for body text and for headings: a TTF path, or a built-in PDF font name. */
export interface CueCardFonts {
  regular: string;
  semibold: string;
}

const require = createRequire(import.meta.url);

/** The file path of a package file, or null when it is not installed. */
function resolveFile(specifier: string): string | null {
  try {
    const p = require.resolve(specifier);
    return existsSync(p) ? p : null;
  } catch {
    return null;
  }
}

let cached: CueCardFonts | null = null;

/** Inter when both files resolve, else Helvetica / Helvetica-Bold (resolved once). */
export function cueCardFonts(): CueCardFonts {
  if (cached) return cached;
  const regular = resolveFile('@expo-google-fonts/inter/400Regular/Inter_400Regular.ttf');
  const semibold = resolveFile('@expo-google-fonts/inter/600SemiBold/Inter_600SemiBold.ttf');
  cached = regular && semibold ? { regular, semibold } : { regular: 'Helvetica', semibold: 'Helvetica-Bold' };
  return cached;
}
