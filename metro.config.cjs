// Metro stays CommonJS while the rest of the project is ESM ("type": "module").
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');
const { FileStore } = require('@expo/metro/metro-cache');

const config = getDefaultConfig(__dirname);

// Keep Metro's cache inside the project instead of the system temp folder.
config.cacheStores = [new FileStore({ root: path.join(__dirname, 'node_modules', '.cache', 'metro') })];

// drei's OrbitControls imports all of three-stdlib; point it at the single file (Metro does not tree-shake).
const orbitControlsFile = path.join(__dirname, 'node_modules', 'three-stdlib', 'controls', 'OrbitControls.js');
const upstreamResolve = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === 'three-stdlib' && context.originModulePath.includes(`${path.sep}drei${path.sep}core${path.sep}OrbitControls`)) {
    return { type: 'sourceFile', filePath: orbitControlsFile };
  }
  return (upstreamResolve ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;
