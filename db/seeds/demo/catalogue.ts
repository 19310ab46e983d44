/*
 * The invented item master of the invented Fennick Supply Co., a hardware wholesaler (see docs/design.md).
 * Descriptions and weights are made up for the demo; weights are rough per unit of measure.
 */
export type UnitOfMeasure = "EA" | "BOX" | "PK" | "M";

export type CatalogueItem = {
  sku: string;
  description: string;
  unitOfMeasure: UnitOfMeasure;
  unitWeightG: number;
};

function item(sku: string, description: string, unitOfMeasure: UnitOfMeasure, unitWeightG: number): CatalogueItem {
  return { sku, description, unitOfMeasure, unitWeightG: Math.round(unitWeightG) };
}

/** Approximate mass of one steel hex bolt, M-size d mm by length l mm (shank plus head), in grams. */
function boltG(d: number, l: number): number {
  return 7.85e-3 * (Math.PI / 4) * d * d * (l + 0.7 * d);
}

function fasteners(): CatalogueItem[] {
  const out: CatalogueItem[] = [];
  for (const d of [6, 8, 10, 12]) {
    for (const l of [30, 50, 80]) {
      const per = d >= 12 ? 50 : 100;
      out.push(
        item(`HB-M${d}X${l}-Z`, `M${d} × ${l} mm hex bolt, zinc, box of ${per}`, "BOX", boltG(d, l) * per + 120),
      );
    }
  }
  for (const d of [6, 8, 10, 12, 16]) {
    out.push(item(`HN-M${d}-Z`, `M${d} hex nut, zinc, box of 200`, "BOX", (0.45 * d * d * 200) / 10 + 80));
    out.push(item(`WA-M${d}-Z`, `M${d} flat washer form A, zinc, box of 500`, "BOX", (0.12 * d * d * 500) / 10 + 80));
  }
  for (const [d, l] of [
    [3.5, 30],
    [4, 40],
    [4, 50],
    [5, 60],
    [5, 80],
    [6, 100],
  ] as const) {
    out.push(
      item(
        `WS-${d * 10}X${l}`,
        `${d} × ${l} mm wood screw, countersunk, yellow passivated, box of 200`,
        "BOX",
        (0.006 * d * d * l * 200) / 10 + 60,
      ),
    );
  }
  for (const d of [6, 8, 10]) out.push(item(`WP-${d}`, `${d} mm nylon wall plug, pack of 100`, "PK", d * 12));
  for (const d of [8, 10, 12])
    out.push(item(`TR-M${d}-1M`, `M${d} threaded rod, zinc, 1 m length`, "EA", 0.62 * d * d * 10));
  for (const d of [8, 10, 12]) out.push(item(`AB-M${d}`, `M${d} through-bolt anchor, pack of 10`, "PK", d * d * 9));
  for (const l of [25, 40, 65]) out.push(item(`RN-${l}`, `${l} mm round wire nail, bright, 1 kg box`, "BOX", 1050));
  return out;
}

function fittings(): CatalogueItem[] {
  const out: CatalogueItem[] = [];
  for (const mm of [15, 22, 28]) {
    const g = mm * 4;
    out.push(item(`CE-${mm}`, `${mm} mm brass compression elbow`, "EA", g));
    out.push(item(`CT-${mm}`, `${mm} mm brass compression tee`, "EA", g * 1.4));
    out.push(item(`CS-${mm}`, `${mm} mm brass compression straight coupler`, "EA", g * 0.8));
    out.push(item(`IV-${mm}`, `${mm} mm isolating valve, chrome`, "EA", g * 1.8));
  }
  for (const mm of [75, 100]) {
    out.push(item(`BH-${mm}`, `${mm} mm steel butt hinge, pair`, "PK", mm * 2.2));
    out.push(item(`BH-${mm}-SS`, `${mm} mm stainless butt hinge, pair`, "PK", mm * 2.4));
  }
  for (const mm of [40, 60, 100]) out.push(item(`AN-${mm}`, `${mm} mm angle bracket, zinc, pack of 10`, "PK", mm * 9));
  for (const mm of [150, 250]) out.push(item(`TB-${mm}`, `${mm} mm tower bolt, black`, "EA", mm * 1.1));
  out.push(item("HP-450", "450 mm T-hinge, galvanised", "EA", 520));
  out.push(item("GL-KIT", "gate latch kit, galvanised", "EA", 380));
  for (const [mm, gPerM] of [
    [4, 330],
    [6, 760],
    [8, 1350],
  ] as const)
    out.push(item(`CHN-${mm}-G`, `${mm} mm galvanised welded chain, cut to length`, "M", gPerM));
  for (const [mm, gPerM] of [
    [6, 25],
    [10, 65],
    [12, 95],
  ] as const)
    out.push(item(`RP-${mm}`, `${mm} mm polypropylene rope, cut to length`, "M", gPerM));
  for (const mm of [5, 8]) out.push(item(`SH-${mm}`, `M${mm} galvanised bow shackle`, "EA", mm * mm * 1.6));
  for (const mm of [25, 50]) out.push(item(`PC-${mm}`, `${mm} mm pipe clip, pack of 10`, "PK", mm * 3));
  out.push(item("PTFE-12", "PTFE thread seal tape, 12 m × 12 mm", "EA", 15));
  out.push(item("SIL-CL", "sanitary silicone sealant, clear, 310 ml", "EA", 360));
  out.push(item("GR-400", "general purpose grease, 400 g cartridge", "EA", 450));
  out.push(item("TIE-200", "cable ties 200 mm, black, pack of 100", "PK", 110));
  out.push(item("TIE-370", "cable ties 370 mm, black, pack of 100", "PK", 260));
  return out;
}

function handTools(): CatalogueItem[] {
  const t = (sku: string, description: string, g: number) => item(sku, description, "EA", g);
  return [
    t("HM-CLAW16", "claw hammer, 16 oz, fibreglass handle", 780),
    t("HM-CLAW20", "claw hammer, 20 oz, steel shaft", 960),
    t("HM-CLUB25", "club hammer, 2.5 lb", 1350),
    t("HM-SLED10", "sledgehammer, 10 lb, hickory handle", 5200),
    t("HM-MALLET", "rubber mallet, 24 oz", 820),
    t("SD-SET6", "screwdriver set, slotted and cross, 6 pieces", 640),
    t("SD-PZ2", "cross-point screwdriver PZ2 × 100 mm", 110),
    t("SD-INS7", "insulated screwdriver set, 7 pieces", 720),
    t("SP-COMB12", "combination spanner set, 8–19 mm, 12 pieces", 1900),
    t("SP-ADJ250", "adjustable spanner, 250 mm", 410),
    t("SP-ADJ300", "adjustable spanner, 300 mm", 650),
    t("SK-SET40", "socket set, 1/4 and 3/8 in drive, 40 pieces", 2400),
    t("HK-SET9", "hex key set, ball end, 9 pieces", 320),
    t("PL-COMB200", "combination pliers, 200 mm", 310),
    t("PL-LONG200", "long-nose pliers, 200 mm", 230),
    t("PL-WP250", "water pump pliers, 250 mm", 340),
    t("PL-LOCK250", "locking pliers, 250 mm", 480),
    t("CU-SIDE160", "side cutters, 160 mm", 190),
    t("CU-BOLT600", "bolt cutters, 600 mm", 2800),
    t("SW-HACK300", "hacksaw, 300 mm, with blade", 620),
    t("SW-HAND550", "hardpoint hand saw, 550 mm", 540),
    item("SW-BLADE10", "hacksaw blades, 24 tpi, pack of 10", "PK", 160),
    t("TM-5M", "tape measure, 5 m", 230),
    t("TM-8M", "tape measure, 8 m", 340),
    t("SL-600", "spirit level, 600 mm", 520),
    t("SL-1200", "spirit level, 1200 mm", 980),
    t("KN-UTIL", "retractable utility knife", 180),
    t("KN-BLADE100", "utility knife blades, dispenser of 100", 270),
    t("CH-SET4", "wood chisel set, 4 pieces", 760),
    t("CH-COLD25", "cold chisel, 25 mm", 410),
    t("WB-900", "wrecking bar, 900 mm", 2600),
    t("WB-600", "wrecking bar, 600 mm", 1500),
    t("FL-FLAT250", "flat file, 250 mm, second cut", 330),
    t("CL-F300", "F-clamp, 300 mm", 780),
    t("CL-QUICK450", "one-handed bar clamp, 450 mm", 620),
    t("RV-GUN", "hand riveter with 4 nosepieces", 690),
    t("CG-SEAL", "sealant gun, skeleton", 340),
    t("TS-TROWEL", "brick trowel, 11 in", 450),
    t("GL-WORK-L", "work gloves, large, pair", 120),
    t("EP-SAFETY", "safety glasses, clear", 45),
  ];
}

/** Every SKU in a fixed order: the demo's bin assignment depends on it. */
export function fennickCatalogue(): CatalogueItem[] {
  return [...fasteners(), ...fittings(), ...handTools()];
}
