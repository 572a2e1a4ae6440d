import tseslint from "typescript-eslint";

// Client-side code (bundled for the browser) validates with zod/mini through knowledge/contracts/zod:
// classic zod costs several hundred KB in the web bundle, and bare zod/mini has no English messages.
const viaContracts = 'Import zod from knowledge/contracts/zod (zod/mini with English messages).';
const clientZod = [
  { name: "zod", message: `Classic zod is for server/ only. ${viaContracts}` },
  { name: "zod/v4", message: `Classic zod is for server/ only. ${viaContracts}` },
  { name: "zod/v3", message: `Classic zod is for server/ only. ${viaContracts}` },
  { name: "zod/mini", message: viaContracts },
  { name: "zod/v4/mini", message: viaContracts },
  { name: "zod/v4-mini", message: viaContracts },
];

export default tseslint.config(
  { ignores: ["node_modules/", "dist/", "build/", "data/", ".expo/", "db/migrations/", "coverage/", "expo-env.d.ts"] },
  ...tseslint.configs.recommended,
  {
    rules: {
      "@typescript-eslint/no-require-imports": "off",
      "@typescript-eslint/no-unused-vars": ["error", { argsIgnorePattern: "^_", varsIgnorePattern: "^_" }],
      "@typescript-eslint/no-namespace": "off",
    },
  },
  {
    files: ["**/*.js", "**/*.mjs", "**/*.cjs"],
    languageOptions: { globals: { process: "readonly", console: "readonly", __dirname: "readonly", module: "writable", require: "readonly" } },
  },
  {
    // The client must not reach into the server, and knowledge imports nothing of ours but itself.
    files: ["app/**", "components/**", "hooks/**"],
    rules: { "no-restricted-imports": ["error", { paths: clientZod, patterns: ["**/server/*", "**/db/*"] }] },
  },
  {
    files: ["knowledge/**"],
    rules: {
      "no-restricted-imports": ["error", { paths: clientZod, patterns: ["**/server/*", "**/db/*", "**/hooks/*", "**/components/*", "react", "react-native", "express"] }],
    },
  },
  {
    // The one module that loads zod/mini (and its English messages) for the client side.
    files: ["knowledge/contracts/zod.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { paths: clientZod.filter((p) => p.name !== "zod/mini"), patterns: ["**/server/*", "**/db/*", "**/hooks/*", "**/components/*", "react", "react-native", "express"] },
      ],
    },
  },
);
