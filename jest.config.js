/** One config, several projects: pure knowledge, API (supertest on in-memory PGlite), components, soak. */
const esmPackages = [
  "better-auth",
  "@better-auth",
  "better-call",
  "file-type",
  "strtok3",
  "token-types",
  "peek-readable",
  "uint8array-extras",
  "@tokenizer",
  "@borewit",
  "jose",
  "nanostores",
  "@noble",
  "rou3",
  "defu",
  "uncrypto",
  "kysely",
  "@electric-sql",
].join("|");

const swc = [
  "@swc/jest",
  {
    jsc: { parser: { syntax: "typescript", tsx: true }, target: "es2022", transform: { react: { runtime: "automatic" } } },
    module: { type: "commonjs" },
  },
];

const nodeProject = (name, roots) => ({
  displayName: name,
  testEnvironment: "node",
  testMatch: roots.map((r) => `<rootDir>/tests/${r}/**/*.test.ts`),
  transform: { "^.+\\.(t|j|mj|cj)sx?$": swc },
  transformIgnorePatterns: [`/node_modules/(?!(${esmPackages})/)`],
  moduleNameMapper: { "^file-type$": "<rootDir>/node_modules/file-type/index.js" },
});

module.exports = {
  testTimeout: 60000,
  projects: [
    nodeProject("knowledge", ["unit", "reference"]),
    nodeProject("api", ["api"]),
    nodeProject("soak", ["soak"]),
    nodeProject("e2e", ["e2e"]),
    {
      displayName: "ui",
      preset: "jest-expo",
      testMatch: ["<rootDir>/tests/ui/**/*.test.tsx"],
      setupFiles: ["<rootDir>/tests/ui/setup-timers.ts"],
      // The preset's transforms, plus .mjs/.cjs through the same babel setup for ESM-only packages.
      transform: (() => {
        const preset = require("jest-expo/jest-preset").transform;
        const js = preset["\\.[jt]sx?$"];
        return { ...preset, "\\.[mc]js$": js };
      })(),
      transformIgnorePatterns: [
        `/node_modules/(?!(.pnpm|react-native|@react-native|@react-native-community|expo|@expo|@expo-google-fonts|react-navigation|@react-navigation|${esmPackages}))`,
        "/node_modules/react-native-reanimated/plugin/",
        "/node_modules/@react-native/babel-preset/",
      ],
    },
  ],
};
