// The tightening sequence of a head's studs, and where each stud sits as the head is seen from above.
// Pure. Derived from the stud pattern the model uses (which bores each stud serves, in order along a
// side): common practice tightens from the middle of the head outward, alternating sides, so the head
// is pulled down evenly and the gasket is not rolled towards one end.
import type { Stud } from "../clamp";

export interface PlacedStud {
  /** Index in the engine's stud list. */
  index: number;
  label: string;
  /** 0 for an inline engine or the first bank of a V, 1 for the second. */
  bank: number;
  /** 0: the first side of the bank (top of the drawing), 1: the other. */
  side: number;
  /** Position along the bank in bore pitches: bore i (1-based within the bank) spans [i−1, i]. */
  x: number;
  /** 1-based order of tightening within its bank (each head has its own sequence). */
  order: number;
}

export interface StudLayout {
  banks: number;
  boresPerBank: number;
  studs: PlacedStud[];
}

const SIDE_LABEL = /^([LR])?([AB])\d+$/;

/**
 * Places each stud: its bank from the cylinders it serves (V: bank A has cylinders 1…n/2); its side from
 * its label when it follows the A/B naming, else the first half of the bank's studs is one side; along
 * the side, evenly from one end of the bank to the other in list order (how the default pattern lists them).
 */
export function layoutStuds(studs: readonly Stud[], cylinders: number, layout: "inline" | "V"): StudLayout {
  const banks = layout === "V" && cylinders % 2 === 0 ? 2 : 1;
  const perBank = cylinders / banks;
  const bankOf = (s: Stud) => (banks === 2 && Math.min(...s.serves.map((v) => v.cylinder)) > perBank ? 1 : 0);
  const placed: PlacedStud[] = [];
  for (let bank = 0; bank < banks; bank++) {
    const own = studs.map((s, index) => ({ s, index })).filter(({ s }) => bankOf(s) === bank);
    const named = own.every(({ s }) => SIDE_LABEL.test(s.label ?? ""));
    const half = Math.ceil(own.length / 2);
    const sides = [0, 1].map((side) =>
      own.filter(({ s }, i) => (named ? (SIDE_LABEL.exec(s.label ?? "")![2] === "B" ? 1 : 0) : i >= half ? 1 : 0) === side),
    );
    sides.forEach((list, side) => {
      list.forEach(({ s, index }, j) => {
        const x = list.length > 1 ? (j * perBank) / (list.length - 1) : perBank / 2;
        placed.push({ index, label: s.label ?? `S${index + 1}`, bank, side, x, order: 0 });
      });
    });
    // middle outward; at equal distance the nearer-the-front end first, alternating the two sides
    const centre = perBank / 2;
    const mine = placed.filter((p) => p.bank === bank);
    const rank = (p: PlacedStud) => Math.round(Math.abs(p.x - centre) * 1e6);
    mine.sort((a, b) => rank(a) - rank(b) || a.x - b.x || a.side - b.side);
    // alternate sides inside each ring of equal distance: A, B, A, B …
    const ordered: PlacedStud[] = [];
    for (let i = 0; i < mine.length;) {
      let j = i;
      while (j < mine.length && rank(mine[j]!) === rank(mine[i]!)) j++;
      const ring = mine.slice(i, j);
      const a = ring.filter((p) => p.side === 0);
      const b = ring.filter((p) => p.side === 1);
      const startB = ordered.length > 0 && ordered.at(-1)!.side === 0;
      const [first, second] = startB ? [b, a] : [a, b];
      for (let k = 0; k < Math.max(a.length, b.length); k++) {
        if (first[k]) ordered.push(first[k]!);
        if (second[k]) ordered.push(second[k]!);
      }
      i = j;
    }
    ordered.forEach((p, k) => (p.order = k + 1));
  }
  placed.sort((a, b) => a.index - b.index);
  return { banks, boresPerBank: perBank, studs: placed };
}
