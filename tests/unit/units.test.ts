import fs from "node:fs";
import path from "node:path";
import * as full from "mathjs";
import * as nodeUnits from "../../knowledge/units";
import * as nodeConcentration from "../../knowledge/concentration";

/*
 * The unit engine comes in two builds: knowledge/units.ts (node, jest) takes mathjs's unit
 * factories from the package root, knowledge/units.web.ts (Metro) requires them file by file.
 * Both must read every typed quantity as the full mathjs package does.
 */

const ROOT = path.resolve(__dirname, "../..");
const WEB_SOURCE = fs.readFileSync(path.join(ROOT, "knowledge/units.web.ts"), "utf8");
const MATHJS_ROOT = path.dirname(require.resolve("mathjs/package.json"));

// jest, like Node, refuses paths a package does not export; metro.config.js resolves them for
// Metro. Here each one maps to the same file.
const webRequires = [...WEB_SOURCE.matchAll(/require\("(mathjs\/lib\/cjs\/[^"]+)"\)/g)].map((m) => m[1]!);
for (const spec of new Set(webRequires)) {
  jest.doMock(spec, () => jest.requireActual(path.join(MATHJS_ROOT, spec.slice("mathjs/".length))), { virtual: true });
}
const webUnits = require("../../knowledge/units.web") as typeof nodeUnits;
let webConcentration!: typeof nodeConcentration;
jest.isolateModules(() => {
  jest.doMock("../../knowledge/units", () => webUnits);
  webConcentration = require("../../knowledge/concentration");
});

/** Factory names reachable from a dependency map (what `create` needs to build it). */
function factoryNames(deps: object, into = new Set<string>()): Set<string> {
  for (const [key, value] of Object.entries(deps)) {
    if (typeof value === "function") into.add(key);
    else if (value && typeof value === "object") factoryNames(value, into);
  }
  return into;
}

const TYPED = [
  // volumes
  "250 mL", "250mL", "0.5 L", "1 l", "1 dL", "2.5 dl", "5 uL", "5 ul", "50 µL", "50 μL", "50µL", "1 cL",
  "1 cc", "1 m^3", "3 cm^3", "1e3 mL", "1.5e-2 L", "0 mL", "-5 mL", "1 ML", "2 gallon", "1 floz",
  // temperatures
  "25 degC", "-10 degC", "77 degF", "298.15 K", "0 K", "300 K", "25 °C", "25°C", "77 °F", "25 ºC",
  // amounts per volume
  "3 M", "250 mM", "10 µM", "10 uM", "1 mol/L", "0.1 mol / L", "3 mmol/mL", "5 mmol/L", "1 umol/mL", "1 mol L-1",
  "50 g/L", "5 mg/mL", "2 kg/L", "10 g L-1", "1 ug/uL", "3 mol/dm^3",
  // masses
  "2.5 g", "500 mg", "1 kg", "10 ug", "10 µg", "1 lb", "3 mol",
  // decimal comma
  "1,5 L", "0,25 M",
  // garbage
  "", " ", "abc", "mL", "L mL", "10 furlongs", "5 m", "5 µ", "5 u", "1 mL mL", "1 mL/", "/L", "1 L + 2 L",
  "NaN mL", "Infinity L", "1e400 L", "0x10 mL", "--5 mL", "5 mL)", "5 (mL)", "5 mL^", "5 degC/s", "25 C",
  "one litre", "5 % w/w", "12 pH", "1 mL; drop table", "\u0000", "5\u00a0mL",
] as const;

type Outcome = { units: string; si: string; value: number } | { error: string };

function outcome(unit: typeof full.unit, text: string): Outcome {
  try {
    const u = unit(text);
    return { units: u.formatUnits(), si: u.toSI().toString(), value: u.toNumber() };
  } catch (e) {
    return { error: (e as Error).message };
  }
}

function parsed(parse: typeof nodeConcentration.parseQuantity, text: string) {
  try {
    return parse(text);
  } catch (e) {
    return { error: (e as Error).message };
  }
}

describe("unit engine", () => {
  it("the web build is given exactly the factories `unit` depends on", () => {
    const listed = new Set([...WEB_SOURCE.matchAll(/^\s+(create\w+): require\(/gm)].map((m) => m[1]!));
    expect([...listed].sort()).toEqual([...factoryNames(full.unitDependencies!)].sort());
    // one require per factory, plus `create` itself
    expect(webRequires).toHaveLength(listed.size + 1);
  });

  it("the web build loads no file of mathjs that lists every function", () => {
    expect(webRequires.filter((s) => /factoriesAny|entry\/|index\.js|defaultInstance/.test(s))).toEqual([]);
  });

  it.each(TYPED.map((t) => [JSON.stringify(t), t] as const))("%s reads alike in the full package and both builds", (_label, text) => {
    const expected = outcome(full.unit, text);
    expect(outcome(nodeUnits.unit, text)).toEqual(expected);
    expect(outcome(webUnits.unit, text)).toEqual(expected);
  });

  it.each(TYPED.map((t) => [JSON.stringify(t), t] as const))("%s gives the same parseQuantity answer on web and server", (_label, text) => {
    expect(parsed(webConcentration.parseQuantity, text)).toEqual(parsed(nodeConcentration.parseQuantity, text));
  });

  it("the lists cover successes and failures alike", () => {
    const results = TYPED.map((t) => parsed(nodeConcentration.parseQuantity, t));
    expect(results.filter((r) => "error" in r).length).toBeGreaterThan(20);
    expect(results.filter((r) => !("error" in r)).length).toBeGreaterThan(40);
  });

  // Independent values: SI prefixes (BIPM SI Brochure, 9th ed., table 7) and the exact
  // definitions of the kelvin and degree Fahrenheit scales (T/°C = T/K − 273.15, T/°F = 1.8·T/°C + 32).
  it.each([
    ["50 µL", "volume", 0.05, "mL"],
    ["50 μL", "volume", 0.05, "mL"],
    ["1 dL", "volume", 100, "mL"],
    ["1 cL", "volume", 10, "mL"],
    ["3 cm^3", "volume", 3, "mL"],
    ["77 degF", "temperature", 25, "°C"],
    ["0 K", "temperature", -273.15, "°C"],
    ["3 mmol/mL", "molarity", 3, "mol/L"],
    ["10 µM", "molarity", 1e-5, "mol/L"],
    ["10 uM", "molarity", 1e-5, "mol/L"],
    ["5 mg/mL", "mass-concentration", 5, "g/L"],
    ["1 ug/uL", "mass-concentration", 1, "g/L"],
    ["1 kg", "mass", 1000, "g"],
    ["10 µg", "mass", 1e-5, "g"],
    ["5\u00a0mL", "volume", 5, "mL"],
  ] as const)("%s → %s %f %s with the web build", (text, kind, value, unit) => {
    const q = webConcentration.parseQuantity(text);
    expect(q.kind).toBe(kind);
    expect(q.value).toBeCloseTo(value, 9);
    expect(q.unit).toBe(unit);
  });

  it.each(["5 µ", "5 u", "5 degC/s", "10 furlongs"])("rejects %j with the web build", (text) => {
    expect(() => webConcentration.parseQuantity(text)).toThrow(expect.objectContaining({ name: "KnowledgeInputError" }));
  });
});
