// Default stud pattern: which bores each stud serves, and its share of each (docs/clamp-model.md §7, studs to bores).
import type { Stud } from "./schema";

/**
 * Studs along both sides of each bank, evenly spaced from one end of the bank to the other.
 * ours (docs/clamp-model.md §7): a stud on the line between two bores serves both (½ each); an end stud, or one
 * that falls beside a single bore, serves that bore alone. Cylinders are numbered bank by bank
 * (V: bank A 1…n/2, bank B n/2+1…n).
 * studsPerSide defaults to bores-per-bank + 1 (one between each pair of bores and one at each end).
 */
export function defaultStudPattern(layout: "inline" | "V", cylinders: number, studsPerSide?: number): Stud[] {
  const banks = layout === "V" ? 2 : 1;
  if (!Number.isInteger(cylinders) || cylinders < 1 || cylinders % banks !== 0) {
    throw new RangeError(layout === "V" ? "A V engine needs an even number of cylinders" : "Cylinder count must be a whole number ≥ 1");
  }
  const perBank = cylinders / banks;
  const m = studsPerSide ?? perBank + 1;
  if (!Number.isInteger(m) || m < 2) throw new RangeError("At least two studs per side");
  const studs: Stud[] = [];
  const sides = ["A", "B"] as const;
  for (let bank = 0; bank < banks; bank++) {
    const first = bank * perBank + 1;
    for (const side of sides) {
      for (let j = 0; j < m; j++) {
        // position along the bank in bore pitches: bore i occupies [i, i+1)
        const x = (j * perBank) / (m - 1);
        const nearest = Math.round(x);
        const serves: Stud["serves"] = [];
        if (Math.abs(x - nearest) < 1e-9) {
          if (nearest > 0) serves.push({ cylinder: first + nearest - 1, share: 1 });
          if (nearest < perBank) serves.push({ cylinder: first + nearest, share: 1 });
        } else {
          serves.push({ cylinder: first + Math.floor(x), share: 1 });
        }
        for (const s of serves) s.share = 1 / serves.length;
        const bankName = banks === 2 ? (bank === 0 ? "L" : "R") : "";
        studs.push({ label: `${bankName}${side}${j + 1}`, serves });
      }
    }
  }
  return studs;
}
