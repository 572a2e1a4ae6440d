import type { AqueousSolute, DensityPoint, SourceKey, Sourced } from "./types";

/*
 * Aqueous work-up solutions: density at 20 °C against mass % of the anhydrous solute, from
 * the CRC Handbook's "Concentrative properties of aqueous solutions" (102nd ed., read), and
 * saturation at about 20 °C (recalled from memory). Where saturation lies a little beyond the
 * table's last row, one point is extrapolated linearly to it and the note says so.
 */

const CRC: SourceKey = "crc-aqueous-2021";
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
    synonyms: ["H2O", "DI water", "deionised water", "deionized water", "distilled water", "pure water", "tap water"],
    cas: "7732-18-5",
    molarMassGPerMol: 18.015,
    points: { value: [{ massFractionPct: 0, densityGPerMl: WATER_DENSITY_20C_G_PER_ML }], source: "kell-1975-from-memory" },
    saturationWtPct: null,
  },
  {
    key: "sodium-chloride",
    name: "Sodium chloride",
    formula: "NaCl",
    synonyms: ["NaCl", "brine", "sat. brine", "saturated brine", "saturated NaCl", "sat. NaCl", "sat NaCl", "sodium chloride solution", "salt water", "half-saturated brine"],
    cas: "7647-14-5",
    molarMassGPerMol: 58.443,
    points: table(
      [
        [0.5, 1.0018], [1, 1.0053], [2, 1.0125], [3, 1.0196], [4, 1.0268], [5, 1.034], [6, 1.0413], [7, 1.0486],
        [8, 1.0559], [9, 1.0633], [10, 1.0707], [11, 1.0781], [12, 1.0857], [13, 1.0932], [14, 1.1008], [15, 1.1085],
        [16, 1.1162], [17, 1.124], [18, 1.1319], [19, 1.1398], [20, 1.1478], [21, 1.1558], [22, 1.164], [23, 1.1721],
        [24, 1.1804], [25, 1.1887], [26, 1.1972], [26.4, 1.2006],
      ],
      CRC,
      "the 26.4 % point is extrapolated linearly from the 25–26 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(26.4, "35.9 g per 100 g water at 20 °C"),
  },
  {
    key: "hydrochloric-acid",
    name: "Hydrochloric acid",
    formula: "HCl",
    synonyms: ["HCl", "hydrogen chloride", "muriatic acid", "aq. HCl", "conc. HCl", "concentrated hydrochloric acid", "dilute HCl"],
    cas: "7647-01-0",
    molarMassGPerMol: 36.461,
    points: table([
      [0.5, 1.0007], [1, 1.0031], [2, 1.0081], [3, 1.013], [4, 1.0179], [5, 1.0228], [6, 1.0278], [7, 1.0327], [8, 1.0377],
      [9, 1.0426], [10, 1.0476], [11, 1.0526], [12, 1.0576], [13, 1.0626], [14, 1.0676], [15, 1.0726], [16, 1.0777],
      [17, 1.0828], [18, 1.0878], [19, 1.0929], [20, 1.098], [22, 1.1083], [24, 1.1185], [26, 1.1288], [28, 1.1391],
      [30, 1.1492], [32, 1.1594], [34, 1.1693], [36, 1.1791], [38, 1.1886], [40, 1.1977],
    ]),
    saturationWtPct: null,
  },
  {
    key: "sodium-hydroxide",
    name: "Sodium hydroxide",
    formula: "NaOH",
    synonyms: ["NaOH", "caustic soda", "lye", "soda lye", "aq. NaOH", "sodium hydrate"],
    cas: "1310-73-2",
    molarMassGPerMol: 39.997,
    points: table(
      [
        [0.5, 1.0039], [1, 1.0095], [2, 1.0207], [3, 1.0318], [4, 1.0428], [5, 1.0538], [6, 1.0648], [7, 1.0758],
        [8, 1.0869], [9, 1.0979], [10, 1.1089], [11, 1.1199], [12, 1.1309], [13, 1.1419], [14, 1.153], [15, 1.164],
        [16, 1.1751], [17, 1.1861], [18, 1.1971], [19, 1.2082], [20, 1.2192], [22, 1.2412], [24, 1.2631], [26, 1.2848],
        [28, 1.3064], [30, 1.3277], [32, 1.3488], [34, 1.3697], [36, 1.3901], [38, 1.4102], [40, 1.4299],
        [44, 1.4685], [48, 1.5065], [50, 1.5253],
      ],
      "crc-aqueous-2021-perry-from-memory",
      "0–40 % read from the CRC table; the 44, 48 and 50 % points are recalled from Perry's and not re-read",
    ),
    saturationWtPct: saturation(52.2, "109 g per 100 g water at 20 °C; the table ends at 50 %"),
  },
  {
    key: "potassium-hydroxide",
    name: "Potassium hydroxide",
    formula: "KOH",
    synonyms: ["KOH", "caustic potash", "potash lye", "aq. KOH"],
    cas: "1310-58-3",
    molarMassGPerMol: 56.105,
    points: table([
      [0.5, 1.0025], [1, 1.0068], [2, 1.0155], [3, 1.0242], [4, 1.033], [5, 1.0419], [6, 1.0509], [7, 1.0599], [8, 1.069],
      [9, 1.0781], [10, 1.0873], [11, 1.0966], [12, 1.1059], [13, 1.1153], [14, 1.1246], [15, 1.1341], [16, 1.1435],
      [17, 1.1531], [18, 1.1626], [19, 1.1722], [20, 1.1818], [22, 1.2014], [24, 1.221], [26, 1.2408], [28, 1.2609],
      [30, 1.2813], [32, 1.302], [34, 1.323], [36, 1.3444], [38, 1.3661], [40, 1.3881], [42, 1.4104], [44, 1.4331],
      [46, 1.456], [48, 1.4791], [50, 1.5024],
    ]),
    saturationWtPct: saturation(52.8, "112 g per 100 g water at 20 °C; the table ends at 50 %"),
  },
  {
    key: "sodium-bicarbonate",
    name: "Sodium bicarbonate",
    formula: "NaHCO3",
    synonyms: ["NaHCO3", "bicarb", "bicarbonate", "sodium bicarbonate", "sodium hydrogen carbonate", "baking soda", "sat. NaHCO3", "sat. bicarb", "saturated bicarbonate", "saturated sodium bicarbonate", "aq. NaHCO3"],
    cas: "144-55-8",
    molarMassGPerMol: 84.007,
    points: table(
      [
        [0.5, 1.0018], [1, 1.0054], [1.5, 1.0089], [2, 1.0125], [2.5, 1.016], [3, 1.0196], [3.5, 1.0231], [4, 1.0266],
        [4.5, 1.0301], [5, 1.0337], [5.5, 1.0372], [6, 1.0408], [8.7, 1.06],
      ],
      CRC,
      "the table ends at 6 %; the 8.7 % point is extrapolated linearly from the 5–6 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(8.7, "9.6 g per 100 g water at 20 °C"),
  },
  {
    key: "sodium-carbonate",
    name: "Sodium carbonate",
    formula: "Na2CO3",
    synonyms: ["Na2CO3", "soda ash", "washing soda", "sat. Na2CO3", "sodium carbonate solution", "aq. Na2CO3"],
    cas: "497-19-8",
    molarMassGPerMol: 105.989,
    points: table(
      [
        [0.5, 1.0034], [1, 1.0086], [2, 1.019], [3, 1.0294], [4, 1.0398], [5, 1.0502], [6, 1.0606], [7, 1.0711],
        [8, 1.0816], [9, 1.0922], [10, 1.1029], [11, 1.1136], [12, 1.1244], [13, 1.1353], [14, 1.1463], [15, 1.1574],
        [17.7, 1.1874],
      ],
      CRC,
      "the table ends at 15 %; the 17.7 % point is extrapolated linearly from the 14–15 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(17.7, "21.5 g anhydrous per 100 g water at 20 °C"),
  },
  {
    key: "potassium-carbonate",
    name: "Potassium carbonate",
    formula: "K2CO3",
    synonyms: ["K2CO3", "potash", "pearl ash", "sat. K2CO3", "potassium carbonate solution", "aq. K2CO3"],
    cas: "584-08-7",
    molarMassGPerMol: 138.206,
    points: table(
      [
        [0.5, 1.0027], [1, 1.0072], [2, 1.0163], [3, 1.0254], [4, 1.0345], [5, 1.0437], [6, 1.0529], [7, 1.0622],
        [8, 1.0715], [9, 1.0809], [10, 1.0904], [12, 1.1095], [14, 1.1291], [16, 1.149], [18, 1.1692], [20, 1.1898],
        [24, 1.232], [28, 1.2755], [32, 1.3204], [36, 1.3665], [40, 1.4142], [44, 1.4633], [48, 1.5142], [50, 1.5404],
        [52.6, 1.5745],
      ],
      CRC,
      "the 52.6 % point is extrapolated linearly from the 48–50 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(52.6, "111 g per 100 g water at 20 °C"),
  },
  {
    key: "ammonium-chloride",
    name: "Ammonium chloride",
    formula: "NH4Cl",
    synonyms: ["NH4Cl", "sal ammoniac", "sat. NH4Cl", "saturated NH4Cl", "saturated ammonium chloride", "aq. NH4Cl"],
    cas: "12125-02-9",
    molarMassGPerMol: 53.492,
    points: table(
      [
        [0.5, 0.9998], [1, 1.0014], [2, 1.0045], [3, 1.0076], [4, 1.0107], [5, 1.0138], [6, 1.0168], [7, 1.0198],
        [8, 1.0227], [9, 1.0257], [10, 1.0286], [11, 1.0315], [12, 1.0344], [13, 1.0373], [14, 1.0401], [15, 1.0429],
        [16, 1.0457], [17, 1.0485], [18, 1.0512], [19, 1.054], [20, 1.0567], [22, 1.0621], [24, 1.0674], [27.1, 1.0756],
      ],
      CRC,
      "the table ends at 24 %; the 27.1 % point is extrapolated linearly from the 22–24 % slope to the saturation limit",
    ),
    saturationWtPct: saturation(27.1, "37.2 g per 100 g water at 20 °C"),
  },
  {
    key: "sulfuric-acid",
    name: "Sulfuric acid",
    formula: "H2SO4",
    synonyms: ["H2SO4", "sulphuric acid", "oil of vitriol", "aq. H2SO4", "conc. H2SO4", "dilute sulfuric acid"],
    cas: "7664-93-9",
    molarMassGPerMol: 98.079,
    points: table([
      [0.5, 1.0016], [1, 1.0049], [2, 1.0116], [3, 1.0183], [4, 1.025], [5, 1.0318], [6, 1.0385], [7, 1.0453], [8, 1.0522],
      [9, 1.0591], [10, 1.0661], [12, 1.0802], [14, 1.0947], [16, 1.1094], [18, 1.1245], [20, 1.1398], [22, 1.1554],
      [24, 1.1714], [26, 1.1872], [28, 1.2031], [30, 1.2191], [32, 1.2353], [34, 1.2518], [36, 1.2685], [38, 1.2855],
      [40, 1.3028], [42, 1.3205], [44, 1.3386], [46, 1.357], [48, 1.3759], [50, 1.3952], [52, 1.4149], [54, 1.4351],
      [56, 1.4558], [58, 1.477], [60, 1.4987], [62, 1.52], [64, 1.5421], [66, 1.5646], [68, 1.5874], [70, 1.6105],
      [72, 1.6338], [74, 1.6574], [76, 1.681], [78, 1.7043], [80, 1.7272], [82, 1.7491], [84, 1.7693], [86, 1.7872],
      [88, 1.8022], [90, 1.8144], [92, 1.824], [94, 1.8312], [96, 1.8355], [98, 1.8361],
    ]),
    saturationWtPct: null,
  },
  {
    key: "lithium-chloride",
    name: "Lithium chloride",
    formula: "LiCl",
    synonyms: ["LiCl", "aq. LiCl", "lithium chloride solution"],
    cas: "7447-41-8",
    molarMassGPerMol: 42.394,
    points: table([
      [0.5, 1.0012], [1, 1.0041], [2, 1.0099], [3, 1.0157], [4, 1.0215], [5, 1.0272], [6, 1.033], [7, 1.0387], [8, 1.0444],
      [9, 1.0502], [10, 1.056], [12, 1.0675], [14, 1.0792], [16, 1.091], [18, 1.1029], [20, 1.115], [22, 1.1274],
      [24, 1.1399], [26, 1.1527], [28, 1.1658], [30, 1.1791],
    ]),
    saturationWtPct: saturation(45.4, "83 g per 100 g water at 20 °C; the table ends at 30 %"),
  },
  {
    key: "calcium-chloride",
    name: "Calcium chloride",
    formula: "CaCl2",
    synonyms: ["CaCl2", "aq. CaCl2", "calcium chloride solution"],
    cas: "10043-52-4",
    molarMassGPerMol: 110.984,
    points: table([
      [0.5, 1.0024], [1, 1.0065], [2, 1.0148], [3, 1.0232], [4, 1.0316], [5, 1.0401], [6, 1.0486], [7, 1.0572], [8, 1.0659],
      [9, 1.0747], [10, 1.0835], [12, 1.1014], [14, 1.1198], [16, 1.1386], [18, 1.1579], [20, 1.1775], [22, 1.1976],
      [24, 1.218], [26, 1.2388], [28, 1.26], [30, 1.2816], [32, 1.3036], [34, 1.326], [36, 1.3488], [38, 1.372],
      [40, 1.3957],
    ]),
    saturationWtPct: saturation(42.7, "74.5 g anhydrous per 100 g water at 20 °C; the table ends at 40 %"),
  },
  {
    key: "citric-acid",
    name: "Citric acid",
    formula: "C6H8O7",
    synonyms: ["citric acid", "2-hydroxypropane-1,2,3-tricarboxylic acid", "aq. citric acid", "citric acid solution"],
    cas: "77-92-9",
    molarMassGPerMol: 192.124,
    points: table([
      [0.5, 1.0002], [1, 1.0022], [2, 1.0063], [3, 1.0105], [4, 1.0147], [5, 1.0189], [6, 1.0232], [7, 1.0274], [8, 1.0316],
      [9, 1.0359], [10, 1.0402], [12, 1.049], [14, 1.058], [16, 1.0672], [18, 1.0764], [20, 1.0858], [22, 1.0953],
      [24, 1.1049], [26, 1.1147], [28, 1.1246], [30, 1.1346],
    ]),
    saturationWtPct: saturation(59.2, "≈ 145 g anhydrous per 100 g water at 20 °C; the table ends at 30 %"),
  },
  {
    key: "sodium-sulfate",
    name: "Sodium sulfate",
    formula: "Na2SO4",
    synonyms: ["Na2SO4", "sodium sulphate", "aq. Na2SO4", "sodium sulfate solution"],
    cas: "7757-82-6",
    molarMassGPerMol: 142.043,
    points: table([
      [0.5, 1.0027], [1, 1.0071], [2, 1.0161], [3, 1.0252], [4, 1.0343], [5, 1.0436], [6, 1.0526], [7, 1.0619], [8, 1.0713],
      [9, 1.0808], [10, 1.0905], [11, 1.1002], [12, 1.1101], [13, 1.1201], [14, 1.1301], [15, 1.1402], [16, 1.1503],
      [17, 1.1604], [18, 1.1705], [19, 1.1806], [20, 1.1907], [22, 1.2106],
    ]),
    saturationWtPct: saturation(16.3, "19.5 g anhydrous per 100 g water at 20 °C (rises steeply up to 32 °C)"),
  },
  {
    key: "sodium-thiosulfate",
    name: "Sodium thiosulfate",
    formula: "Na2S2O3",
    synonyms: ["Na2S2O3", "thiosulfate", "sodium thiosulphate", "hypo", "aq. Na2S2O3", "sat. Na2S2O3"],
    cas: "7772-98-7",
    molarMassGPerMol: 158.108,
    points: table([
      [0.5, 1.0024], [1, 1.0065], [2, 1.0148], [3, 1.0231], [4, 1.0315], [5, 1.0399], [6, 1.0483], [7, 1.0568], [8, 1.0654],
      [9, 1.074], [10, 1.0827], [12, 1.1003], [14, 1.1182], [16, 1.1365], [18, 1.1551], [20, 1.174], [22, 1.1932],
      [24, 1.2128], [26, 1.2328], [28, 1.2532], [30, 1.2739], [32, 1.295], [34, 1.3164], [36, 1.3382], [38, 1.3603],
      [40, 1.3827],
    ]),
    saturationWtPct: saturation(41.2, "70 g anhydrous per 100 g water at 20 °C; the table ends at 40 %"),
  },
  {
    key: "ammonia",
    name: "Ammonia (aqueous)",
    formula: "NH3",
    synonyms: ["NH3", "aqueous ammonia", "ammonium hydroxide", "NH4OH", "ammonia solution", "conc. ammonia", "aq. NH3", "7664-41-7"],
    cas: "1336-21-6",
    molarMassGPerMol: 17.031,
    points: table([
      [0.5, 0.996], [1, 0.9938], [2, 0.9895], [3, 0.9853], [4, 0.9811], [5, 0.977], [6, 0.973], [7, 0.969], [8, 0.9651],
      [9, 0.9613], [10, 0.9575], [11, 0.9538], [12, 0.9502], [13, 0.9466], [14, 0.9431], [15, 0.9396], [16, 0.9361],
      [17, 0.9327], [18, 0.9294], [19, 0.9261], [20, 0.9228], [22, 0.9164], [24, 0.9102], [26, 0.904], [28, 0.898],
      [30, 0.892],
    ]),
    saturationWtPct: null,
  },
];
