// The fastener maker's figures in a plan: torque, stages, lubricant, the friction that lubricant
// implies (the library row's friction, recorded for the maker's lubricant) and the stretch figure.
// When the builder picks another fastener, the plan takes the new maker's figures and says so;
// the builder may then change them. Pure: display strings in, display strings out.
import { fromDisplay, parseQuantity, toDisplay, unitFor, unitsOf, type DisplayUnit, type UnitSystem } from "../units";

export interface MakerFigures {
  id: number;
  name: string;
  makerTorqueNm: number | null;
  makerLubricant: string | null;
  makerStages: string | null;
  makerStretchMm: number | null;
  threadFriction: number;
  bearingFriction: number;
}

/** Fractions of the final torque for the usual three-stage pull-down when the maker gives none. */
export const DEFAULT_STAGE_FRACTIONS = [0.4, 0.7];

/** A torque rounded to what a torque wrench is set to: whole N·m, or whole lbf·ft. */
export function wrenchSetting(torqueNm: number, system: UnitSystem): number {
  const unit = unitFor("torque", system);
  // a hair added so a half (0.7 × 115 = 80.5) rounds up even when floating point makes it 80.4999…
  return fromDisplay("torque", Math.round(toDisplay("torque", torqueNm, unit) + 1e-9), unit);
}

/** Stages at the given fractions of the final torque, each at a wrench setting, ending at the torque itself. */
export function wrenchStages(torqueNm: number, system: UnitSystem, fractions = DEFAULT_STAGE_FRACTIONS): number[] {
  const out: number[] = [];
  for (const f of fractions) {
    const s = wrenchSetting(torqueNm * f, system);
    if (s > 0 && s < torqueNm && (out.length === 0 || s > out[out.length - 1]!)) out.push(s);
  }
  return [...out, torqueNm];
}

/** Stages scaled to a new final torque, keeping their proportions, each at a wrench setting. */
export function scaledWrenchStages(stagesNm: number[], fromNm: number, toNm: number, system: UnitSystem): number[] {
  if (stagesNm.length === 0 || !(fromNm > 0)) return [toNm];
  return wrenchStages(
    toNm,
    system,
    stagesNm.slice(0, -1).map((s) => s / fromNm),
  );
}

const NUMBER_WORDS: Record<string, number> = { two: 2, three: 3, four: 4, five: 5, six: 6 };

/**
 * The maker's stage text ("40, 80, then 115 lbf·ft", "Three even steps to 110 lbf·ft") as torques
 * in N·m ending at the maker's torque, or null when it cannot be read that way.
 */
export function makerStagesNm(text: string | null, makerTorqueNm: number): number[] | null {
  if (!text) return null;
  const unit = writtenTorqueUnit(text) ?? unitMatching(text, makerTorqueNm);
  if (!unit) return null;
  const numbers = [...text.matchAll(/\d+(?:\.\d+)?/g)].map((m) => Number(m[0]));
  const even = /\b(two|three|four|five|six|\d)\s+(?:even|equal)\s+(?:steps|stages|pulls)\b/i.exec(text);
  let stages: number[];
  if (even && numbers.length >= 1) {
    const n = NUMBER_WORDS[even[1]!.toLowerCase()] ?? Number(even[1]);
    const final = numbers[numbers.length - 1]!;
    stages = Array.from({ length: n }, (_, i) => (final * (i + 1)) / n);
  } else stages = numbers;
  const nm = stages.map((v) => fromDisplay("torque", v, unit));
  if (nm.length === 0 || nm.some((s, i) => i > 0 && s <= nm[i - 1]!)) return null;
  // the last stage must be the maker's torque (2 % for rounding in the maker's own unit)
  if (Math.abs(nm[nm.length - 1]! - makerTorqueNm) > makerTorqueNm * 0.02) return null;
  nm[nm.length - 1] = makerTorqueNm;
  return nm;
}

function writtenTorqueUnit(text: string): DisplayUnit | null {
  for (const m of text.matchAll(/\d\s*([a-zA-Z·.-]+(?:[·.-][a-zA-Z]+)?)/g)) {
    const r = parseQuantity(`1 ${m[1]}`, "torque", "N·m");
    if (r.ok) return r.unit;
  }
  return null;
}

function unitMatching(text: string, makerTorqueNm: number): DisplayUnit | null {
  const numbers = [...text.matchAll(/\d+(?:\.\d+)?/g)].map((m) => Number(m[0]));
  const last = numbers[numbers.length - 1];
  if (last === undefined) return null;
  return unitsOf("torque").find((u) => Math.abs(fromDisplay("torque", last, u) - makerTorqueNm) <= makerTorqueNm * 0.02) ?? null;
}

/** Two lubricant names that say the same thing (case, spacing and punctuation aside). */
export function sameLubricant(a: string | null | undefined, b: string | null | undefined): boolean {
  const norm = (s: string | null | undefined) =>
    (s ?? "")
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, " ")
      .trim();
  return norm(a) === norm(b);
}

/** A sentence when the plan's lubricant is not the maker's, or null. */
export function lubricantWarning(planLubricant: string, fastener: Pick<MakerFigures, "makerLubricant"> | null | undefined): string | null {
  const maker = fastener?.makerLubricant?.trim();
  if (!maker || sameLubricant(planLubricant, maker)) return null;
  const plan = planLubricant.trim();
  return `${plan ? `This plan's lubricant (“${plan}”) is not` : "This plan names no lubricant; the maker's is"} the maker's (“${maker}”). The maker's torque is for their lubricant: another lubricant changes the friction, and so the clamp the same torque gives. Set the friction to what you measured or know for yours.`;
}

// The form fields the maker's figures fill, and the fingerprint that tells whether the builder has
// touched them since they were shown (see figuresFollowStep).
export const FOLLOWED_FIELDS = ["torque", "stages", "lubricant", "threadFriction", "bearingFriction", "targetStretch"] as const;

export function figuresFingerprint(values: Record<string, unknown>): string {
  return FOLLOWED_FIELDS.map((k) =>
    String(values[k] ?? "")
      .trim()
      .replace(/\s+/g, " "),
  ).join("|");
}

const torqueText = (nm: number, system: UnitSystem) => String(Number(toDisplay("torque", nm, unitFor("torque", system)).toFixed(1)));

/** The fields the new fastener's figures set, as the form shows them. */
export function makerFieldValues(f: MakerFigures, current: Record<string, string>, system: UnitSystem): Record<string, string> {
  const out: Record<string, string> = {
    lubricant: f.makerLubricant?.trim() || current.lubricant || "",
    threadFriction: String(f.threadFriction),
    bearingFriction: String(f.bearingFriction),
  };
  if (f.makerTorqueNm !== null) {
    const torqueNm = wrenchSetting(f.makerTorqueNm, system);
    const stages = makerStagesNm(f.makerStages, f.makerTorqueNm)?.map((s) => wrenchSetting(s, system)) ?? wrenchStages(torqueNm, system);
    stages[stages.length - 1] = torqueNm;
    out.torque = torqueText(torqueNm, system);
    out.stages = stages.map((s) => torqueText(s, system)).join(", ");
  }
  if (f.makerStretchMm !== null) {
    const unit = unitFor("smallLength", system);
    out.targetStretch = String(Number(toDisplay("smallLength", f.makerStretchMm, unit).toFixed(system === "metric" ? 3 : 2)));
  }
  return out;
}

/** The line the builder reads after the figures followed a new fastener. */
export function followedNote(f: MakerFigures): string {
  if (f.makerTorqueNm === null)
    return `Lubricant and friction now follow the library's figures for ${f.name}; no maker's torque is recorded for it, so the torque and stages are as they were. Change them if you mean to.`;
  return `Torque, stages and lubricant now follow the maker's figures for ${f.name}; change them if you mean to.`;
}

/** The form after the fastener changed to `next`: its figures, the note, and the fingerprint of what is now shown. */
export function followFastener(
  current: Record<string, string>,
  next: MakerFigures,
  system: UnitSystem,
): { values: Record<string, string>; note: string } {
  const values = { ...current, ...makerFieldValues(next, current, system) };
  values.figuresFastenerId = String(next.id);
  values.figuresSeen = figuresFingerprint(values);
  return { values, note: followedNote(next) };
}

/**
 * A post of the plan form (without JavaScript) in which the fastener changed while the torque, stages,
 * lubricant and friction are still exactly what was shown for the old fastener: answer with the new
 * fastener's figures (nothing saved) rather than save the old stud's figures under the new stud.
 */
export function figuresFollowStep(
  form: Record<string, string>,
  fasteners: MakerFigures[],
  system: UnitSystem,
): { values: Record<string, string>; note: string } | null {
  const shownFor = form.figuresFastenerId;
  if (!shownFor || form.fastenerId === shownFor) return null;
  if (figuresFingerprint(form) !== form.figuresSeen) return null;
  const next = fasteners.find((f) => String(f.id) === form.fastenerId);
  if (!next) return null;
  const followed = followFastener(form, next, system);
  // the new maker's figures are the ones already there: nothing to say, the post goes ahead
  if (figuresFingerprint(followed.values) === figuresFingerprint(form)) return null;
  return followed;
}

/** A new plan's figures when there is no plan to start from: the maker's, or wrench-set defaults. */
export function makerPlanFigures(f: MakerFigures | undefined, system: UnitSystem) {
  const torqueNm = f?.makerTorqueNm != null ? wrenchSetting(f.makerTorqueNm, system) : wrenchSetting(100, system);
  const makerStages = f?.makerTorqueNm != null ? makerStagesNm(f.makerStages, f.makerTorqueNm) : null;
  const stagesNm = makerStages ? makerStages.map((s) => wrenchSetting(s, system)) : wrenchStages(torqueNm, system);
  stagesNm[stagesNm.length - 1] = torqueNm;
  return {
    fastenerId: f?.id ?? 0,
    lubricant: f?.makerLubricant?.trim() ?? "",
    threadFriction: f?.threadFriction ?? 0.12,
    bearingFriction: f?.bearingFriction ?? 0.12,
    torqueNm,
    stagesNm,
  };
}
