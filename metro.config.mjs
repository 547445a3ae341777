// Metro's configuration (an ES module like the rest of the project; Metro imports it).
import path from 'node:path';

import { FileStore } from '@expo/metro/metro-cache';
import { getDefaultConfig } from 'expo/metro-config.js';

const projectRoot = import.meta.dirname;
const config = getDefaultConfig(projectRoot);

// Keep Metro's cache inside the project instead of the system temp folder.
config.cacheStores = [new FileStore({ root: path.join(projectRoot, 'node_modules', '.cache', 'metro') })];

// drei's OrbitControls imports all of three-stdlib; point it at the single file (Metro does not tree-shake).
const orbitControlsFile = path.join(projectRoot, 'node_modules', 'three-stdlib', 'controls', 'OrbitControls.js');
// zod re-exports every message locale as `z.locales` and `z.core.locales` (≈70 KB gzipped that every
// screen would load); the app uses only English, which zod's schemas import on their own: point both at it.
const zodV4 = `${path.sep}zod${path.sep}v4${path.sep}`;
/** @param {'js' | 'cjs'} ext */
const zodEnglish = (ext) => path.join(projectRoot, 'node_modules', 'zod', 'v4', 'locales', `en.${ext}`);
const upstreamResolve = config.resolver.resolveRequest;
/** @type {import('@expo/metro/metro-resolver').CustomResolver} */
const resolveRequest = (context, moduleName, platform) => {
  if (moduleName === 'three-stdlib' && context.originModulePath.includes(`${path.sep}drei${path.sep}core${path.sep}OrbitControls`)) {
    return { type: 'sourceFile', filePath: orbitControlsFile };
  }
  if (/^\.\.\/locales\/index\.c?js$/.test(moduleName) && context.originModulePath.includes(zodV4)) {
    return { type: 'sourceFile', filePath: zodEnglish(moduleName.endsWith('.cjs') ? 'cjs' : 'js') };
  }
  return (upstreamResolve ?? context.resolveRequest)(context, moduleName, platform);
};
config.resolver.resolveRequest = resolveRequest;

export default config;
