import type { AqueousSolute, DensityPoint, SourceKey, Sourced } from "./types";

/*
 * Aqueous work-up solutions: density at 20 °C against mass % of the anhydrous solute, as
 * tabulated in the CRC Handbook's "Concentrative properties of aqueous solutions" (recalled
 * from memory — see the source keys) and saturation at about 20 °C.
 */

const CRC: SourceKey = "crc-aqueous-from-memory";
const SOLUBILITY: SourceKey = "crc-solubility-from-memory";

/** Pure water at 20 °C (Kell 1975), the first point of every table. */
export const WATER_DENSITY_20C_G_PER_ML = 0.9982;

function table(pairs: [number, number][], source: SourceKey = CRC, note?: string): Sourced<DensityPoint[]> {
  const points = [[0, WATER_DENSITY_20C_G_PER_ML] as [number, number], ...pairs].map(([w, d]) => ({
    massFractionPct: w,
    densityGPerMl: d,
  }));
  return note === undefined ? { value: points, source } : { value: points, source, note };
}

function saturation(pct: number, note?: string, source: SourceKey = SOLUBILITY): Sourced<number> {
  return note === undefined ? { value: pct, source } : { value: pct, source, note };
}

export const AQUEOUS_SOLUTES: AqueousSolute[] = [
  {
    key: "water",
    name: "Water",
    formula: "H2O",
    synonyms: ["H2O", "DI water", "deionised water", "distilled water", "pure water"],
    cas: "7732-18-5",
    molarMassGPerMol: 18.015,
    points: { value: [{ massFractionPct: 0, densityGPerMl: WATER_DENSITY_20C_G_PER_ML }], source: "kell-1975-from-memory" },
    saturationWtPct: null,
  },
  {
    key: "sodium-chloride",
    name: "Sodium chloride",
    formula: "NaCl",
    synonyms: ["NaCl", "brine", "sat. brine", "saturated brine", "saturated NaCl", "sat. NaCl", "salt", "sodium chloride solution", "half-saturated brine"],
    cas: "7647-14-5",
    molarMassGPerMol: 58.44,
    points: table(
      [
        [1, 1.0053], [2, 1.0125], [4, 1.0268], [6, 1.0413], [8, 1.0559], [10, 1.0707], [12, 1.0857],
        [14, 1.1008], [16, 1.1162], [18, 1.1319], [20, 1.1478], [22, 1.164], [24, 1.1804], [26, 1.1972],
        [26.4, 1.2006],
      ],
      CRC,
      "the 26.4 % point is extrapolated linearly from the 24–26 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(26.4, "35.9 g per 100 g water at 20 °C"),
  },
  {
    key: "hydrochloric-acid",
    name: "Hydrochloric acid",
    formula: "HCl",
    synonyms: ["HCl", "hydrogen chloride", "muriatic acid", "aq. HCl", "conc. HCl", "concentrated hydrochloric acid"],
    cas: "7647-01-0",
    molarMassGPerMol: 36.46,
    points: table([
      [1, 1.0031], [2, 1.0081], [4, 1.0179], [6, 1.0278], [8, 1.0377], [10, 1.0476], [12, 1.0576],
      [14, 1.0676], [16, 1.0777], [18, 1.0878], [20, 1.098], [22, 1.1083], [24, 1.1185], [26, 1.1288],
      [28, 1.1391], [30, 1.1492], [32, 1.1594], [34, 1.1693], [36, 1.1789], [38, 1.1885],
    ]),
    saturationWtPct: null,
  },
  {
    key: "sodium-hydroxide",
    name: "Sodium hydroxide",
    formula: "NaOH",
    synonyms: ["NaOH", "caustic soda", "lye", "soda lye", "aq. NaOH", "sodium hydrate"],
    cas: "1310-73-2",
    molarMassGPerMol: 40.0,
    points: table([
      [1, 1.0095], [2, 1.0207], [4, 1.0428], [6, 1.0648], [8, 1.0869], [10, 1.1089], [12, 1.1309],
      [14, 1.153], [16, 1.1751], [18, 1.1972], [20, 1.2191], [24, 1.2629], [28, 1.3064], [32, 1.349],
      [36, 1.39], [40, 1.43], [44, 1.4685], [48, 1.5065], [50, 1.5253],
    ]),
    saturationWtPct: saturation(52.2, "109 g per 100 g water at 20 °C; the table ends at 50 %"),
  },
  {
    key: "potassium-hydroxide",
    name: "Potassium hydroxide",
    formula: "KOH",
    synonyms: ["KOH", "caustic potash", "potash lye", "aq. KOH"],
    cas: "1310-58-3",
    molarMassGPerMol: 56.11,
    points: table([
      [1, 1.0083], [2, 1.0175], [4, 1.0359], [6, 1.0544], [8, 1.073], [10, 1.0918], [12, 1.1108],
      [14, 1.1299], [16, 1.1493], [18, 1.1688], [20, 1.1884], [24, 1.2285], [28, 1.2695], [32, 1.3117],
      [36, 1.3549], [40, 1.3991], [44, 1.4440], [48, 1.4897], [50, 1.5129],
    ]),
    saturationWtPct: saturation(52.8, "112 g per 100 g water at 20 °C; the table ends at 50 %"),
  },
  {
    key: "sodium-bicarbonate",
    name: "Sodium bicarbonate",
    formula: "NaHCO3",
    synonyms: ["NaHCO3", "bicarb", "sodium bicarbonate", "sodium hydrogen carbonate", "baking soda", "sat. NaHCO3", "sat. bicarb", "saturated sodium bicarbonate"],
    cas: "144-55-8",
    molarMassGPerMol: 84.01,
    points: table(
      [[1, 1.0054], [2, 1.0127], [4, 1.0275], [6, 1.0422], [8, 1.057], [8.7, 1.0621]],
      CRC,
      "the 8.7 % point is extrapolated linearly from the 6–8 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(8.7, "9.6 g per 100 g water at 20 °C"),
  },
  {
    key: "sodium-carbonate",
    name: "Sodium carbonate",
    formula: "Na2CO3",
    synonyms: ["Na2CO3", "soda ash", "washing soda", "sat. Na2CO3", "sodium carbonate solution"],
    cas: "497-19-8",
    molarMassGPerMol: 105.99,
    points: table([
      [1, 1.0086], [2, 1.019], [4, 1.0398], [6, 1.0606], [8, 1.0816], [10, 1.1029], [12, 1.1244],
      [14, 1.1463], [16, 1.1682], [18, 1.1905],
    ]),
    saturationWtPct: saturation(17.7, "21.5 g anhydrous per 100 g water at 20 °C"),
  },
  {
    key: "potassium-carbonate",
    name: "Potassium carbonate",
    formula: "K2CO3",
    synonyms: ["K2CO3", "potash", "pearl ash", "sat. K2CO3", "potassium carbonate solution"],
    cas: "584-08-7",
    molarMassGPerMol: 138.21,
    points: table([
      [1, 1.0072], [2, 1.0163], [4, 1.0345], [6, 1.0529], [8, 1.0715], [10, 1.0904], [12, 1.1095],
      [14, 1.1291], [16, 1.149], [18, 1.1692], [20, 1.1898], [24, 1.232], [28, 1.2755], [32, 1.3204],
      [36, 1.3665], [40, 1.4142], [44, 1.4637], [48, 1.5146], [50, 1.5404],
    ]),
    saturationWtPct: saturation(52.6, "111 g per 100 g water at 20 °C; the table ends at 50 %"),
  },
  {
    key: "ammonium-chloride",
    name: "Ammonium chloride",
    formula: "NH4Cl",
    synonyms: ["NH4Cl", "sal ammoniac", "sat. NH4Cl", "saturated ammonium chloride", "aq. NH4Cl"],
    cas: "12125-02-9",
    molarMassGPerMol: 53.49,
    points: table([
      [1, 1.0013], [2, 1.0045], [4, 1.0107], [6, 1.0168], [8, 1.0227], [10, 1.0286], [12, 1.0344],
      [14, 1.0401], [16, 1.0457], [18, 1.0512], [20, 1.0567], [22, 1.0621], [24, 1.0674], [26, 1.0726],
    ]),
    saturationWtPct: saturation(27.1, "37.2 g per 100 g water at 20 °C; the table ends at 26 %"),
  },
  {
    key: "sulfuric-acid",
    name: "Sulfuric acid",
    formula: "H2SO4",
    synonyms: ["H2SO4", "sulphuric acid", "oil of vitriol", "aq. H2SO4", "conc. H2SO4"],
    cas: "7664-93-9",
    molarMassGPerMol: 98.08,
    points: table([
      [1, 1.0049], [2, 1.0116], [4, 1.025], [6, 1.0385], [8, 1.0522], [10, 1.0661], [12, 1.0802],
      [14, 1.0947], [16, 1.1094], [18, 1.1245], [20, 1.1398], [24, 1.1714], [28, 1.2037], [32, 1.237],
      [36, 1.2708], [40, 1.3051], [50, 1.3951], [60, 1.4983], [70, 1.6105], [80, 1.7272], [90, 1.8144],
      [98, 1.8361],
    ]),
    saturationWtPct: null,
  },
  {
    key: "lithium-chloride",
    name: "Lithium chloride",
    formula: "LiCl",
    synonyms: ["LiCl", "aq. LiCl", "5% LiCl"],
    cas: "7447-41-8",
    molarMassGPerMol: 42.39,
    points: table([
      [1, 1.0039], [2, 1.0095], [4, 1.0207], [6, 1.0318], [8, 1.0428], [10, 1.0538], [12, 1.0649],
      [14, 1.0762], [16, 1.0876], [18, 1.0992], [20, 1.1108],
    ]),
    saturationWtPct: saturation(45.4, "83 g per 100 g water at 20 °C; the table ends at 20 %"),
  },
  {
    key: "calcium-chloride",
    name: "Calcium chloride",
    formula: "CaCl2",
    synonyms: ["CaCl2", "aq. CaCl2", "calcium chloride solution"],
    cas: "10043-52-4",
    molarMassGPerMol: 110.98,
    points: table([
      [1, 1.0068], [2, 1.0148], [4, 1.0316], [6, 1.0486], [8, 1.0659], [10, 1.0835], [12, 1.1015],
      [14, 1.1198], [16, 1.1386], [18, 1.1578], [20, 1.1775], [25, 1.2284], [30, 1.2816], [35, 1.3373],
      [40, 1.3957],
    ]),
    saturationWtPct: saturation(42.7, "74.5 g anhydrous per 100 g water at 20 °C; the table ends at 40 %"),
  },
  {
    key: "citric-acid",
    name: "Citric acid",
    formula: "C6H8O7",
    synonyms: ["citric acid", "2-hydroxypropane-1,2,3-tricarboxylic acid", "aq. citric acid", "10% citric acid"],
    cas: "77-92-9",
    molarMassGPerMol: 192.12,
    points: table([
      [1, 1.0019], [2, 1.0057], [4, 1.0133], [6, 1.021], [8, 1.0287], [10, 1.0367], [12, 1.0447],
      [14, 1.0529], [16, 1.0611], [18, 1.0695], [20, 1.078], [24, 1.0953], [28, 1.1132], [30, 1.1224],
    ]),
    saturationWtPct: saturation(59.2, "≈ 145 g anhydrous per 100 g water at 20 °C; the table ends at 30 %"),
  },
  {
    key: "sodium-sulfate",
    name: "Sodium sulfate",
    formula: "Na2SO4",
    synonyms: ["Na2SO4", "sodium sulphate", "Glauber's salt solution", "aq. Na2SO4"],
    cas: "7757-82-6",
    molarMassGPerMol: 142.04,
    points: table([
      [1, 1.0073], [2, 1.0164], [4, 1.0348], [6, 1.0535], [8, 1.0724], [10, 1.0915], [12, 1.1109],
      [14, 1.1306], [16, 1.1506],
    ]),
    saturationWtPct: saturation(16.3, "19.5 g anhydrous per 100 g water at 20 °C (rises steeply to 32 °C)"),
  },
  {
    key: "ammonia",
    name: "Ammonia (aqueous)",
    formula: "NH3",
    synonyms: ["NH3", "aqueous ammonia", "ammonium hydroxide", "NH4OH", "ammonia solution", "conc. ammonia", "aq. NH3"],
    cas: "1336-21-6",
    molarMassGPerMol: 17.03,
    points: table([
      [1, 0.9939], [2, 0.9895], [4, 0.9811], [6, 0.9730], [8, 0.9651], [10, 0.9575], [12, 0.9501],
      [16, 0.9362], [20, 0.9229], [24, 0.9101], [28, 0.898], [30, 0.892],
    ]),
    saturationWtPct: null,
  },
];
