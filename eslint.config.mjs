import tseslint from "typescript-eslint";

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
    rules: { "no-restricted-imports": ["error", { patterns: ["**/server/*", "**/db/*"] }] },
  },
  {
    files: ["knowledge/**"],
    rules: { "no-restricted-imports": ["error", { patterns: ["**/server/*", "**/db/*", "**/hooks/*", "**/components/*", "react", "react-native", "express"] }] },
  },
);
