// Expo's default Metro setup, plus one resolver entry.
const path = require("node:path");
const { getDefaultConfig } = require("expo/metro-config");

const config = getDefaultConfig(__dirname);

// knowledge/units.web.ts requires mathjs's unit factories file by file (Metro does not
// tree-shake the package root). The package's `exports` lists only its entry points, so these
// paths resolve as the plain files they name.
const MATHJS_FILES = "mathjs/lib/cjs/";
const mathjsRoot = path.dirname(require.resolve("mathjs/package.json"));
const resolveNext = config.resolver.resolveRequest;
// zod's barrels re-export every locale; knowledge/contracts/zod.ts only ever loads English.
const ZOD_BARREL = /node_modules[\\/]zod[\\/]v4[\\/](core|mini|classic)[\\/]/;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === "../locales/index.js" && ZOD_BARREL.test(context.originModulePath)) {
    return { type: "sourceFile", filePath: path.join(__dirname, "scripts", "zod-locales-en.js") };
  }
  if (moduleName.startsWith(MATHJS_FILES)) {
    return { type: "sourceFile", filePath: path.join(mathjsRoot, moduleName.slice("mathjs/".length)) };
  }
  return (resolveNext ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;
